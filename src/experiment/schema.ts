import { z } from 'zod';
import { LATENT_NAMES } from '../collect/dataset.js';
import { ACTIVATIONS, BACKENDS, INPUT_CODINGS, OBJECTIVES, OPTIMIZERS, RESETS, RULES, SURROGATES } from '../learn/spec.js';
import { NOISE_KINDS } from '../noise/spec.js';
import { SEED_MEASURES } from '../probe/robustness.js';
import { CHANNELS } from '../senses/channel.js';
import { POLICY_NAMES } from '../collect/policies.js';
import { DEFAULTS } from './defaults.js';

// Keys are the snake_case spelling of the camelCase settings in defaults.ts; every
// default comes from DEFAULTS so the two never drift apart.

const d = DEFAULTS;
const int = (min: number, max: number) => z.number().int().min(min).max(max);
const fraction = z.number().gt(0).lt(1);
const channelList = z.array(z.enum(CHANNELS));

const e = d.learner.encoder;
const hidden = z.array(int(1, 4096)).min(1).max(8).default([...e.hidden]);
const positive = (max: number, fallback: number) => z.number().gt(0).max(max).default(fallback);

const mlpEncoder = z.strictObject({
  kind: z.literal('mlp').default('mlp'),
  hidden,
  activation: z.enum(ACTIVATIONS).default(e.activation),
}).describe('Rate units: hidden layer widths and their activation.');

const spikingEncoder = z.strictObject({
  kind: z.literal('spiking'),
  hidden,
  steps: int(1, 1000).default(e.steps).describe('Time steps T per sample.'),
  dt_ms: positive(100, e.dtMs).describe('Length of a time step, ms.'),
  tau_ms: positive(100_000, e.tauMs).describe('Membrane time constant, ms.'),
  threshold: positive(1_000, e.threshold).describe('Membrane potential at which a unit spikes.'),
  reset: z.enum(RESETS).default(e.reset),
  refractory_ms: z.number().min(0).max(100_000).default(e.refractoryMs).describe('Refractory period, ms: a whole number of time steps.'),
  input_coding: z.enum(INPUT_CODINGS).default(e.inputCoding),
  surrogate: z.enum(SURROGATES).default(e.surrogate),
  surrogate_slope: positive(1_000, e.surrogateSlope).describe('Steepness of the surrogate derivative, per unit of membrane potential.'),
}).describe('Leaky integrate-and-fire units simulated for `steps` time steps per sample.');

const encoder = z.discriminatedUnion('kind', [mlpEncoder, spikingEncoder]);

const train = z.strictObject({
  optimizer: z.enum(OPTIMIZERS).default(d.learner.train.optimizer),
  learning_rate: z.number().gt(0).max(10).default(d.learner.train.learningRate),
  batch: int(1, 65_536).default(d.learner.train.batch),
  epochs: int(1, 10_000).default(d.learner.train.epochs),
  patience: int(1, 10_000).default(d.learner.train.patience),
  temperature: z.number().gt(0).max(100).default(d.learner.train.temperature),
  align_every: int(1, 1_000_000).default(d.learner.train.alignEvery)
    .describe('Non-backprop rules: steps between measurements of the update/gradient angle. Output-only: not part of the cell id.'),
});

const learner = z.strictObject({
  name: z.string().regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'letters, digits, ".", "_" or "-"'),
  objective: z.enum(OBJECTIVES),
  input: channelList.min(1),
  target: channelList.optional().describe('predict and contrast only: channels to predict or align with.'),
  offset: z.union([z.literal(0), z.literal(1)]).default(d.learner.offset),
  supervised_targets: z.array(z.enum(LATENT_NAMES)).optional().describe('supervised only; defaults to the probe targets.'),
  encoder: encoder.prefault({}),
  rule: z.enum(RULES).default(d.learner.rule),
  train: train.prefault({}),
  save_features: z.boolean().default(d.learner.saveFeatures)
    .describe('Also store features.npy and latents.npy of every collected step. Output-only: not part of the cell id.'),
  control: z.boolean().optional()
    .describe(`A control (floor or ceiling): compared with the baseline in the exploratory family only. Defaults to true for ${d.learner.controlObjectives.join(' and ')} learners. Report only: not part of the cell id.`),
});

/** A number, where YAML's .inf (the clean SNR of masking) is allowed too. */
const parameterValue = z.custom<number>((v) => typeof v === 'number' && !Number.isNaN(v), { message: 'expected a number' });

// Only the shape of a noise entry: every rule about values is noise/validate.ts's.
const noise = z.strictObject({
  channel: z.enum(CHANNELS),
  kind: z.enum(NOISE_KINDS),
  severities: z.array(z.number()).default([...d.severities])
    .describe('0 is clean; 1..5 use the documented table; any whole number with explicit parameters.'),
  parameters: z.array(parameterValue).optional()
    .describe('Explicit corruption parameters, one per severity, instead of the documented table.'),
});

/** The one config schema: what `crosswise run` accepts and `crosswise schema` exports. */
export const configSchema = z.strictObject({
  name: z.string().regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'letters, digits, ".", "_" or "-"'),
  world: z.string().min(1).describe('World file, relative to this config file.'),
  seeds: z.array(int(0, 2 ** 31 - 1)).min(1).default([...d.seeds]),
  backend: z.enum(BACKENDS).default(d.backend),
  collect: z.strictObject({
    policy: z.enum(POLICY_NAMES).default(d.collect.policy),
    steps: int(100, 10_000_000).default(d.collect.steps),
    episode_steps: int(2, 1_000_000).default(d.collect.episodeSteps),
    split: z.strictObject({
      train: fraction.default(d.collect.split.train),
      validation: fraction.default(d.collect.split.validation),
      test: fraction.default(d.collect.split.test),
    }).prefault({}),
  }).prefault({}),
  senses: z.strictObject({
    sight: z.strictObject({
      width: int(1, 31).default(d.senses.sight.width),
      depth: int(1, 32).default(d.senses.sight.depth),
    }).prefault({}),
    sound: z.strictObject({
      bands: int(1, 128).default(d.senses.sound.bands),
      min_hz: z.number().min(20).max(20_000).default(d.senses.sound.minHz),
      max_hz: z.number().min(20).max(24_000).default(d.senses.sound.maxHz),
    }).prefault({}),
  }).prefault({}),
  learners: z.array(learner).min(1),
  probe: z.strictObject({
    targets: z.array(z.enum(LATENT_NAMES)).min(1).default([...d.probe.targets]),
    baseline: z.string().optional().describe('A learner name; defaults to the first learner.'),
    primary: z.enum(SEED_MEASURES).default(d.probe.primary)
      .describe('The per-seed robustness measure the primary family tests: noisy, drop or area. Report only: not part of the cell id.'),
  }).prefault({}),
  noise: z.array(noise).default([]),
  vary: z.record(z.string(), z.array(z.unknown()).min(1)).default({})
    .describe('Dotted setting paths (with * over list items) mapped to the values to sweep.'),
  out: z.string().min(1).optional().describe('Output folder, relative to this config file; defaults to runs/<name> beside the config file.'),
});

/** A config after schema validation, still in file spelling (snake_case), every default filled. */
export type FilledConfig = z.output<typeof configSchema>;

/** The config schema as JSON Schema (draft 2020-12), for editors. */
export function configJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(configSchema, {
    io: 'input',
    unrepresentable: 'any',
    override: (context) => { if (context.zodSchema === parameterValue) Object.assign(context.jsonSchema, { type: 'number' }); },
  }) as Record<string, unknown>;
}

/** One learner, and one noise entry, checked on their own (see config-parts.ts). */
export { learner as learnerSchema, noise as noiseEntrySchema };
