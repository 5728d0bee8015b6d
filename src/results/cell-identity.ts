import { createHash } from 'node:crypto';
import { z } from 'zod';
import type { CollectOptions } from '../collect/collector.js';
import { LATENT_NAMES } from '../collect/dataset.js';
import { POLICY_NAMES } from '../collect/policies.js';
import type { SplitFractions } from '../collect/split.js';
import { ACTIVATIONS, INPUT_CODINGS, OBJECTIVES, OPTIMIZERS, RESETS, RULES, SURROGATES, type EncoderSpec, type LearnerSpec } from '../learn/spec.js';
import { NOISE_KINDS, type NoiseSpec } from '../noise/spec.js';
import { CHANNELS, type SenseSettings } from '../senses/channel.js';
import { RESULTS_FORMAT_VERSION } from './format-version.js';

/** What determines a cell's numbers, in the spelling the modules take. */
export interface CellSettings {
  /** The learner's name counts too: two identically configured learners are two cells. */
  readonly learner: LearnerSpec;
  readonly seed: number;
  /** SHA-256 of the world file's bytes (its path does not count). */
  readonly worldSha256: string;
  readonly collect: CollectOptions & { readonly split: SplitFractions };
  readonly senses: SenseSettings;
  readonly probeTargets: readonly string[];
  readonly noise: readonly NoiseSpec[];
  /** The cell's vary values, as text. */
  readonly vary: Readonly<Record<string, string>>;
}

const channels = z.array(z.enum(CHANNELS));

// An MLP encoder's identity has no `kind`, as before spiking encoders existed, so its cells keep their ids.
const encoderIdentity = z.union([
  z.object({ hidden: z.array(z.number().int()), activation: z.enum(ACTIVATIONS) }),
  z.object({
    kind: z.literal('spiking'),
    hidden: z.array(z.number().int()),
    steps: z.number().int(),
    dt_ms: z.number(),
    tau_ms: z.number(),
    threshold: z.number(),
    reset: z.enum(RESETS),
    refractory_ms: z.number(),
    input_coding: z.enum(INPUT_CODINGS),
    surrogate: z.enum(SURROGATES),
    surrogate_slope: z.number(),
  }),
]);

/**
 * A cell's identity as stored in cell.json, in the config's snake_case spelling. It holds
 * what determines the numbers and nothing else: not the backend, the world's path, the
 * probe baseline (a reporting choice) or output-only settings (save_features, align_every).
 */
export const cellIdentitySchema = z.object({
  learner: z.object({
    name: z.string(),
    objective: z.enum(OBJECTIVES),
    input: channels,
    target: channels,
    offset: z.union([z.literal(0), z.literal(1)]),
    supervised_targets: z.array(z.enum(LATENT_NAMES)),
    encoder: encoderIdentity,
    rule: z.enum(RULES),
    train: z.object({
      optimizer: z.enum(OPTIMIZERS),
      learning_rate: z.number(),
      batch: z.number().int(),
      epochs: z.number().int(),
      patience: z.number().int(),
      temperature: z.number(),
    }),
  }),
  seed: z.number().int(),
  world_sha256: z.string(),
  collect: z.object({
    policy: z.enum(POLICY_NAMES),
    steps: z.number().int(),
    episode_steps: z.number().int(),
    split: z.object({ train: z.number(), validation: z.number(), test: z.number() }),
  }),
  senses: z.object({
    sight: z.object({ width: z.number().int(), depth: z.number().int() }),
    sound: z.object({ bands: z.number().int(), min_hz: z.number(), max_hz: z.number() }),
  }),
  probe_targets: z.array(z.string()),
  noise: z.array(z.object({
    channel: z.enum(CHANNELS),
    kind: z.enum(NOISE_KINDS),
    severities: z.array(z.number()),
    parameters: z.array(z.number()).optional(),
  })),
  vary: z.record(z.string(), z.string()),
});

/** A cell's identity, in file spelling. */
export type CellIdentity = z.infer<typeof cellIdentitySchema>;

/** The identity of a cell with these settings. */
export function cellIdentity(settings: CellSettings): CellIdentity {
  const { learner, collect, senses } = settings;
  return {
    learner: {
      name: learner.name,
      objective: learner.objective,
      input: [...learner.input],
      target: [...learner.target],
      offset: learner.offset,
      supervised_targets: [...learner.supervisedTargets],
      encoder: encoderIdentityOf(learner.encoder),
      rule: learner.rule,
      train: {
        optimizer: learner.train.optimizer,
        learning_rate: learner.train.learningRate,
        batch: learner.train.batch,
        epochs: learner.train.epochs,
        patience: learner.train.patience,
        temperature: learner.train.temperature,
      },
    },
    seed: settings.seed,
    world_sha256: settings.worldSha256,
    collect: { policy: collect.policy, steps: collect.steps, episode_steps: collect.episodeSteps, split: { ...collect.split } },
    senses: { sight: { ...senses.sight }, sound: { bands: senses.sound.bands, min_hz: senses.sound.minHz, max_hz: senses.sound.maxHz } },
    probe_targets: [...settings.probeTargets],
    noise: settings.noise.map((entry) => ({
      channel: entry.channel,
      kind: entry.kind,
      severities: [...entry.severities],
      ...(entry.parameters == null ? {} : { parameters: [...entry.parameters] }),
    })),
    vary: { ...settings.vary },
  };
}

function encoderIdentityOf(encoder: EncoderSpec): CellIdentity['learner']['encoder'] {
  if (encoder.kind !== 'spiking') return { hidden: [...encoder.hidden], activation: encoder.activation };
  return {
    kind: 'spiking',
    hidden: [...encoder.hidden],
    steps: encoder.steps,
    dt_ms: encoder.dtMs,
    tau_ms: encoder.tauMs,
    threshold: encoder.threshold,
    reset: encoder.reset,
    refractory_ms: encoder.refractoryMs,
    input_coding: encoder.inputCoding,
    surrogate: encoder.surrogate,
    surrogate_slope: encoder.surrogateSlope,
  };
}

/**
 * A cell's id: the first 10 hex digits of the SHA-256 of the canonical JSON of its
 * identity and the results format version. Equal settings give equal ids on any machine.
 */
export function cellId(identity: CellIdentity): string {
  const hashed = canonicalJson({ format_version: RESULTS_FORMAT_VERSION, identity });
  return createHash('sha256').update(hashed).digest('hex').slice(0, 10);
}

/** JSON with object keys sorted at every level and undefined members left out, so equal values always hash equally. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value != null && typeof value === 'object') {
    const entries = Object.entries(value).filter(([, item]) => item !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([key, item]) => `${JSON.stringify(key)}:${canonicalJson(item)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}
