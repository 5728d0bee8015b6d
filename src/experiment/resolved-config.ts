import type { LatentName } from '../collect/dataset.js';
import type { BackendName, EncoderSpec, LearnerSpec } from '../learn/spec.js';
import type { NoiseSpec } from '../noise/spec.js';
import type { ChannelName, SenseSettings } from '../senses/channel.js';
import { isControl, type CollectSettings, type OutputSettings, type ProbeSettings } from './defaults.js';
import { isPluginPath } from './plugin-bundle.js';
import type { LoadedPlugin, PluginCatalog, PluginRef } from './plugin-catalog.js';
import type { PluginType } from './plugin-shapes.js';
import type { FilledConfig } from './schema.js';

/** A learner as the sweep runs it: what it learns, and what its cells record beside the numbers. */
export interface PlannedLearner {
  readonly spec: LearnerSpec;
  readonly output: OutputSettings;
  /** The plug-ins its objective and rule come from (none when both are built in). */
  readonly plugins: readonly PluginRef[];
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
  /** The plug-ins its policy and noise kinds come from (none when all are built in). */
  readonly plugins: readonly PluginRef[];
}

/** The name of the part a config value names, and the plug-in it comes from when it is a file. */
function part(plugins: PluginCatalog, type: PluginType, value: string): { name: string; refs: PluginRef[] } {
  if (!isPluginPath(value)) return { name: value, refs: [] };
  const { name, path, sha256 } = plugins.resolve(type, value) as LoadedPlugin; // loaded when the config was checked
  return { name, refs: [{ type, name, path, sha256 }] };
}

/** Settings in module spelling for a filled, checked config whose world path is already absolute. */
export function resolveSettings(config: FilledConfig, worldPath: string, plugins: PluginCatalog): ResolvedSettings {
  const probeTargets = config.probe.targets as readonly LatentName[];
  const policy = part(plugins, 'policy', config.collect.policy);
  const noiseKinds = config.noise.map((entry) => part(plugins, 'noise', entry.kind));
  return {
    worldPath,
    collect: {
      policy: policy.name,
      steps: config.collect.steps,
      episodeSteps: config.collect.episode_steps,
      split: { ...config.collect.split },
    },
    senses: {
      sight: { ...config.senses.sight },
      sound: { bands: config.senses.sound.bands, minHz: config.senses.sound.min_hz, maxHz: config.senses.sound.max_hz },
    },
    learners: config.learners.map((learner) => {
      const objective = part(plugins, 'objective', learner.objective);
      const rule = part(plugins, 'rule', learner.rule);
      return {
        spec: { ...learnerSpec(learner, probeTargets), objective: objective.name, rule: rule.name },
        output: { saveFeatures: learner.save_features, alignEvery: learner.train.align_every },
        control: isControl(learner.objective, learner.control),
        plugins: [...objective.refs, ...rule.refs],
      };
    }),
    probe: { targets: probeTargets, baseline: config.probe.baseline ?? config.learners[0].name, primary: config.probe.primary },
    plugins: [...policy.refs, ...noiseKinds.flatMap((kind) => kind.refs)],
    noise: config.noise.map((entry, i) => ({
      channel: entry.channel,
      kind: noiseKinds[i].name,
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
  /** Every plug-in the config names (in any combination), bundled and loaded. */
  readonly plugins: readonly LoadedPlugin[];
  /** `file:line:col: warning: key: message` lines: things that are valid but probably not meant (see constant-targets.ts). */
  readonly warnings: readonly string[];
}
