import { fileURLToPath } from 'node:url';
import { collect } from '../collect/collector.js';
import { splitByEpisode } from '../collect/split.js';
import { LATENT_NAMES, type Dataset, type DatasetSplit, type LatentName } from '../collect/dataset.js';
import { BACKENDS, initBackend, trainLearner, type BackendName, type LearnerSpec, type SpikingEncoderSpec } from '../learn/index.js';
import { stackedEpochSeconds } from '../learn/stacked.js';
import { DEFAULTS, SPIKING_DEFAULTS } from '../experiment/defaults.js';
import { createRng, normal, randomInt } from '../random.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS, type ChannelName } from '../senses/channel.js';
import { loadWorld } from '../world/parse.js';
import { figureOf, type Figure } from './figure.js';

const DEMO_WORLD = fileURLToPath(new URL('../../worlds/greenhouse.yaml', import.meta.url));

/** Experience from the greenhouse demo world at the default sense sizes; a one-episode validation split. */
function demoWorkload(steps: number): { data: Dataset; split: DatasetSplit } {
  const data = collect(loadWorld(DEMO_WORLD), { policy: 'wander', steps, episodeSteps: 100 }, DEFAULT_SENSE_SETTINGS, 1);
  // All but one episode train, so evaluation time stays out of the training figure.
  const episodes = data.episode[steps - 1] + 1;
  return { data, split: splitByEpisode(data, { train: 1 - 1 / episodes, validation: 1 / episodes, test: 0 }, 1) };
}

/**
 * A throughput workload for the reference MLP: Gaussian channels of the given widths, a one-hot action, random
 * latents, episodes of 100 steps. Its content is irrelevant to speed; it is not a world.
 */
function workload(rows: number, sizes: Record<ChannelName, number>): { data: Dataset; split: DatasetSplit } {
  const rng = createRng(0, 'bench');
  const channels = Object.fromEntries(CHANNELS.map((c) => [c, Float32Array.from({ length: rows * sizes[c] }, () => (c === 'motor' ? 0 : normal(rng)))])) as Record<ChannelName, Float32Array>;
  for (let t = 0; t < rows; t++) channels.motor[t * sizes.motor + randomInt(rng, sizes.motor)] = 1;
  const latents = Object.fromEntries(LATENT_NAMES.map((n) => [n, Float32Array.from({ length: rows }, () => randomInt(rng, 4))])) as Record<LatentName, Float32Array>;
  const episode = Int32Array.from({ length: rows }, (_, t) => Math.floor(t / 100));
  const hasNext = Uint8Array.from({ length: rows }, (_, t) => (t + 1 < rows && episode[t + 1] === episode[t] ? 1 : 0));
  const steps = Int32Array.from({ length: rows }, (_, t) => t);
  const data: Dataset = { steps: rows, channelSize: sizes, channels, latents, episode, hasNext, classNames: {} };
  // A one-episode validation split keeps evaluation time out of the training figure.
  return { data, split: { train: steps.subarray(100), validation: steps.subarray(0, 100), test: new Int32Array(0) } };
}

/** The default learner of a config, reading sight and predicting sound; supervised learners predict the default probe targets. */
const DEFAULT_SPEC: LearnerSpec = {
  ...DEFAULTS.learner,
  encoder: { kind: 'mlp', hidden: DEFAULTS.learner.encoder.hidden, activation: DEFAULTS.learner.encoder.activation },
  name: 'bench',
  objective: 'predict',
  input: ['sight'],
  target: ['sound'],
  supervisedTargets: DEFAULTS.probe.targets,
};

/** Training samples per second of each epoch after the first (the warm-up); early stopping is off. */
async function epochRates(spec: LearnerSpec, work: { data: Dataset; split: DatasetSplit }, repeats: number): Promise<Figure> {
  const epochs = repeats + 1;
  const { encoder, log } = await trainLearner({ ...spec, train: { ...spec.train, epochs, patience: epochs } }, work.data, work.split, { seed: 1 });
  encoder.dispose();
  return figureOf(log.slice(1).map((l) => work.split.train.length / l.seconds));
}

/** The reference MLP of the PyTorch comparison: 160 → 128 → 128 → 48, relu, MSE, Adam, batch 256. */
const REFERENCE_SPEC: LearnerSpec = { ...DEFAULT_SPEC, encoder: { hidden: [128, 128], activation: 'relu' } };
const REFERENCE_SIZES: Record<ChannelName, number> = { sight: 160, sound: 48, touch: 0, motor: 5 };

/** Reference-MLP samples per second on each backend (one model, one thread). */
export async function benchReference(repeats: number, quick: boolean): Promise<Record<BackendName, Figure>> {
  const rates = {} as Record<BackendName, Figure>;
  for (const backend of BACKENDS) {
    await initBackend(backend);
    // The cpu backend is ~20× slower: a quarter of the rows keeps its epochs short.
    const rows = (quick || backend === 'cpu' ? 2560 : 10240) + 100;
    rates[backend] = await epochRates(REFERENCE_SPEC, workload(rows, REFERENCE_SIZES), repeats);
  }
  return rates;
}

/** Models trained side by side in the stacked measurement: the quickstart's three seeds of one learner. */
export const STACKED_MODELS = 3;

/**
 * Samples per second summed over STACKED_MODELS reference MLPs trained as one stacked model on
 * wasm (batched matrix products; see learn/stacked.ts), each epoch after the first a repeat.
 */
export async function benchStacked(repeats: number, quick: boolean): Promise<Figure> {
  await initBackend('wasm');
  const rows = quick ? 1024 : 2560;
  const seconds = stackedEpochSeconds({ models: STACKED_MODELS, widths: [160, 128, 128, 48], batch: 256, rows, epochs: repeats + 1 }, 0);
  return figureOf(seconds.slice(1).map((s) => (STACKED_MODELS * rows) / s));
}

const CASES: readonly { label: string; spec: Partial<LearnerSpec> }[] = [
  { label: 'predict sight→sound, backprop', spec: { objective: 'predict' } },
  { label: 'predict sight→sound, feedback alignment', spec: { objective: 'predict', rule: 'feedback-alignment' } },
  { label: 'predict sight→sound, direct feedback alignment', spec: { objective: 'predict', rule: 'direct-feedback-alignment' } },
  { label: 'predict sight+motor→next touch', spec: { objective: 'predict', input: ['sight', 'motor'], target: ['touch'], offset: 1 } },
  { label: 'reconstruct sight', spec: { objective: 'reconstruct' } },
  { label: 'forecast sight', spec: { objective: 'forecast' } },
  { label: 'contrast sight↔sound', spec: { objective: 'contrast' } },
  { label: 'supervised from sight', spec: { objective: 'supervised' } },
];

/** Samples per second per objective and rule at the default sizes ([128, 64] relu, batch 256) on greenhouse data. */
export async function benchObjectives(repeats: number, quick: boolean, backend: BackendName): Promise<Record<string, Figure>> {
  await initBackend(backend);
  const work = demoWorkload(quick ? 2700 : 10300);
  const rates: Record<string, Figure> = {};
  for (const c of CASES) rates[c.label] = await epochRates({ ...DEFAULT_SPEC, ...c.spec }, work, repeats);
  return rates;
}

/** Time steps of the spiking figures: a short and a long simulation of each sample. */
export const SPIKING_STEPS = [8, 25] as const;

/**
 * Samples per second of the quickstart's sound-from-sight learner ([128, 64], batch 256) with a
 * spiking encoder at the default neuron settings, at each of SPIKING_STEPS, on greenhouse data;
 * the rate-MLP figure of the same learner is `predict sight→sound, backprop` of benchObjectives.
 */
export async function benchSpiking(repeats: number, quick: boolean, backend: BackendName): Promise<Record<string, Figure>> {
  await initBackend(backend);
  const work = demoWorkload(quick ? 1100 : 2700);
  const rates: Record<string, Figure> = {};
  for (const steps of SPIKING_STEPS) {
    for (const rule of ['backprop', 'feedback-alignment'] as const) {
      const encoder: SpikingEncoderSpec = { ...SPIKING_DEFAULTS, hidden: DEFAULT_SPEC.encoder.hidden, steps };
      rates[`T=${steps} predict sight→sound, ${rule}`] = await epochRates({ ...DEFAULT_SPEC, encoder, rule }, work, repeats);
    }
  }
  return rates;
}
