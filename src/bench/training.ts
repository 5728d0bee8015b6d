import { fileURLToPath } from 'node:url';
import { collect } from '../collect/collector.js';
import { splitByEpisode } from '../collect/split.js';
import { LATENT_NAMES, type Dataset, type DatasetSplit, type LatentName } from '../collect/dataset.js';
import { initBackend, trainLearner, type BackendName, type LearnerSpec } from '../learn/index.js';
import { createRng, normal, randomInt } from '../random.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS, type ChannelName } from '../senses/channel.js';
import { loadWorld } from '../world/parse.js';
import type { BenchResult } from './result.js';

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

const DEFAULT_SPEC: LearnerSpec = {
  name: 'bench',
  objective: 'predict',
  input: ['sight'],
  target: ['sound'],
  offset: 0,
  supervisedTargets: ['wall_ahead', 'heading', 'nearest_distance_m'],
  encoder: { hidden: [128, 64], activation: 'relu' },
  rule: 'backprop',
  train: { optimizer: 'adam', learningRate: 0.001, batch: 256, epochs: 3, patience: 100, temperature: 0.1 },
};

/** Training samples per second after a warm-up epoch (median over rounds). */
async function samplesPerSecond(spec: LearnerSpec, data: Dataset, split: DatasetSplit, rounds: number): Promise<number> {
  const rates: number[] = [];
  for (let r = 0; r < rounds; r++) {
    const { encoder, log } = await trainLearner(spec, data, split, { seed: 1 });
    encoder.dispose();
    const timed = log.slice(1);
    rates.push((timed.length * split.train.length) / timed.reduce((s, l) => s + l.seconds, 0));
  }
  return rates.sort((a, b) => a - b)[Math.floor(rates.length / 2)];
}

interface Case {
  readonly label: string;
  readonly spec: Partial<LearnerSpec>;
}

const CASES: readonly Case[] = [
  { label: 'predict sight→sound', spec: { objective: 'predict' } },
  { label: 'predict sight→sound', spec: { objective: 'predict', rule: 'feedback-alignment' } },
  { label: 'predict sight→sound', spec: { objective: 'predict', rule: 'direct-feedback-alignment' } },
  { label: 'predict sight+motor→next touch', spec: { objective: 'predict', input: ['sight', 'motor'], target: ['touch'], offset: 1 } },
  { label: 'reconstruct sight', spec: { objective: 'reconstruct' } },
  { label: 'forecast sight', spec: { objective: 'forecast' } },
  { label: 'contrast sight↔sound', spec: { objective: 'contrast' } },
  { label: 'supervised from sight', spec: { objective: 'supervised' } },
];

/** Training throughput per objective at default sizes on greenhouse data, and the 160→128→128→48 reference on cpu and wasm. */
export async function benchTraining(opts: { quick: boolean; backend: BackendName }): Promise<BenchResult[]> {
  const rounds = opts.quick ? 1 : 3;
  const epochs = opts.quick ? 2 : 3;
  const rows: BenchResult[] = [];
  await initBackend(opts.backend);
  const defaults = demoWorkload(opts.quick ? 2700 : 10300);
  for (const c of CASES) {
    const spec: LearnerSpec = { ...DEFAULT_SPEC, ...c.spec, train: { ...DEFAULT_SPEC.train, epochs } };
    rows.push({
      name: `train ${spec.objective} (${spec.rule}, ${opts.backend})`,
      value: await samplesPerSecond(spec, defaults.data, defaults.split, rounds),
      unit: 'samples/s',
      detail: `${c.label}, hidden [${spec.encoder.hidden.join(', ')}] ${spec.encoder.activation}, batch ${spec.train.batch}, ${spec.train.optimizer}, median of ${rounds}`,
    });
  }
  const reference = workload(opts.quick ? 2660 : 10340, { sight: 160, sound: 48, touch: 0, motor: 5 });
  const referenceSpec: LearnerSpec = { ...DEFAULT_SPEC, encoder: { hidden: [128, 128], activation: 'relu' }, train: { ...DEFAULT_SPEC.train, epochs } };
  for (const backend of ['wasm', 'cpu'] as const) {
    await initBackend(backend);
    rows.push({
      name: `train reference MLP (${backend})`,
      value: await samplesPerSecond(referenceSpec, reference.data, reference.split, backend === 'cpu' ? 1 : rounds),
      unit: 'samples/s',
      detail: `160→128→128→48 relu, MSE, adam, batch 256 (PyTorch 1 thread ~175k, STACK.md), median of ${backend === 'cpu' ? 1 : rounds}`,
    });
  }
  await initBackend(opts.backend);
  return rows;
}
