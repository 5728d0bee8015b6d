import type { LatentName } from '../collect/dataset.js';
import type { BackendName, EncoderSpec, LearnerSpec } from '../learn/spec.js';
import type { NoiseSpec } from '../noise/spec.js';
import type { ChannelName, SenseSettings } from '../senses/channel.js';
import { isControl, type CollectSettings, type OutputSettings, type ProbeSettings } from './defaults.js';
import type { FilledConfig } from './schema.js';

/** A learner as the sweep runs it: what it learns, and what its cells record beside the numbers. */
export interface PlannedLearner {
  readonly spec: LearnerSpec;
  readonly output: OutputSettings;
  /** Compared with the baseline in the exploratory family only (report only: not part of the cell id). */
  readonly control: boolean;
}

/** One combination of a sweep's settings, in the camelCase types the modules take. */
export interface ResolvedSettings {
  /** Absolute path of the world file. */
  readonly worldPath: string;
  readonly collect: CollectSettings;
  readonly senses: SenseSettings;
  readonly learners: readonly PlannedLearner[];
  readonly probe: ProbeSettings;
  readonly noise: readonly NoiseSpec[];
}

/** Settings in module spelling for a filled, checked config whose world path is already absolute. */
export function resolveSettings(config: FilledConfig, worldPath: string): ResolvedSettings {
  const probeTargets = config.probe.targets as readonly LatentName[];
  return {
    worldPath,
    collect: {
      policy: config.collect.policy,
      steps: config.collect.steps,
      episodeSteps: config.collect.episode_steps,
      split: { ...config.collect.split },
    },
    senses: {
      sight: { ...config.senses.sight },
      sound: { bands: config.senses.sound.bands, minHz: config.senses.sound.min_hz, maxHz: config.senses.sound.max_hz },
    },
    learners: config.learners.map((learner) => ({
      spec: learnerSpec(learner, probeTargets),
      output: { saveFeatures: learner.save_features, alignEvery: learner.train.align_every },
      control: isControl(learner.objective, learner.control),
    })),
    probe: { targets: probeTargets, baseline: config.probe.baseline ?? config.learners[0].name, primary: config.probe.primary },
    noise: config.noise.map((entry) => ({
      channel: entry.channel,
      kind: entry.kind,
      severities: [...entry.severities],
      ...(entry.parameters == null ? {} : { parameters: [...entry.parameters] }),
    })),
  };
}

function learnerSpec(learner: FilledConfig['learners'][number], probeTargets: readonly LatentName[]): LearnerSpec {
  return {
    name: learner.name,
    objective: learner.objective,
    input: learner.input as ChannelName[],
    target: (learner.target ?? []) as ChannelName[],
    offset: learner.offset,
    supervisedTargets: learner.objective === 'supervised' ? learner.supervised_targets ?? probeTargets : [],
    encoder: encoderSpec(learner.encoder),
    rule: learner.rule,
    train: {
      optimizer: learner.train.optimizer,
      learningRate: learner.train.learning_rate,
      batch: learner.train.batch,
      epochs: learner.train.epochs,
      patience: learner.train.patience,
      temperature: learner.train.temperature,
    },
  };
}

/** An encoder's settings in module spelling. */
export function encoderSpec(encoder: FilledConfig['learners'][number]['encoder']): EncoderSpec {
  if (encoder.kind === 'mlp') return { kind: 'mlp', hidden: [...encoder.hidden], activation: encoder.activation };
  return {
    kind: 'spiking',
    hidden: [...encoder.hidden],
    steps: encoder.steps,
    dtMs: encoder.dt_ms,
    tauMs: encoder.tau_ms,
    threshold: encoder.threshold,
    reset: encoder.reset,
    refractoryMs: encoder.refractory_ms,
    inputCoding: encoder.input_coding,
    surrogate: encoder.surrogate,
    surrogateSlope: encoder.surrogate_slope,
  };
}

/** A sweep as loaded from one config file. */
export interface Sweep {
  readonly name: string;
  /** Absolute path of the config file. */
  readonly configPath: string;
  /** Absolute output folder. */
  readonly out: string;
  readonly seeds: readonly number[];
  readonly backend: BackendName;
  readonly varyKeys: readonly string[];
  /** One entry per combination of vary values (one entry when nothing varies). */
  readonly combinations: readonly { readonly vary: Readonly<Record<string, string>>; readonly settings: ResolvedSettings }[];
  /** The config with every default filled in, as written to config.resolved.yaml. */
  readonly filled: FilledConfig;
  /** `file:line:col: warning: key: message` lines: things that are valid but probably not meant (see constant-targets.ts). */
  readonly warnings: readonly string[];
}
