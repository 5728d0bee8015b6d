import { LATENT_NAMES, type Dataset, type DatasetSplit, type LatentName } from '../../src/collect/dataset.js';
import type { LearnerSpec } from '../../src/learn/spec.js';
import { createRng, normal, randomInt } from '../../src/random.js';
import type { ChannelName } from '../../src/senses/channel.js';

/**
 * A hand-made dataset with known structure (test data, not a world): sight is Gaussian,
 * sound = tanh(sight·A), the action is random, touch = the action's one-hot scaled plus
 * the first sight value, and sight at t+1 = 0.8·sight at t + 0.6·noise + the action's
 * shift, so every objective has something to learn. `heading` = argmax of sight[0..3].
 */
export function syntheticDataset(steps: number, seed = 1, episodeSteps = 50): Dataset {
  const rng = createRng(seed, 'synthetic');
  const size: Record<ChannelName, number> = { sight: 12, sound: 6, touch: 5, motor: 5 };
  const A = Float32Array.from({ length: size.sight * size.sound }, () => normal(rng) / Math.sqrt(size.sight));
  const shift = Float32Array.from({ length: size.motor * size.sight }, () => normal(rng));
  const ch = Object.fromEntries(Object.entries(size).map(([c, s]) => [c, new Float32Array(steps * s)])) as Record<ChannelName, Float32Array>;
  const latents = Object.fromEntries(LATENT_NAMES.map((n) => [n, new Float32Array(steps)])) as Record<LatentName, Float32Array>;
  const episode = new Int32Array(steps);
  const hasNext = new Uint8Array(steps);
  for (let t = 0; t < steps; t++) {
    episode[t] = Math.floor(t / episodeSteps);
    hasNext[t] = t + 1 < steps && Math.floor((t + 1) / episodeSteps) === episode[t] ? 1 : 0;
    const action = randomInt(rng, size.motor);
    ch.motor[t * size.motor + action] = 1;
    const fresh = t % episodeSteps === 0;
    for (let i = 0; i < size.sight; i++) {
      const previous = fresh ? 0 : ch.sight[(t - 1) * size.sight + i];
      ch.sight[t * size.sight + i] = fresh ? normal(rng) : 0.8 * previous + 0.6 * normal(rng) + 0.5 * shift[action * size.sight + i];
    }
    for (let j = 0; j < size.sound; j++) {
      let a = 0;
      for (let i = 0; i < size.sight; i++) a += ch.sight[t * size.sight + i] * A[i * size.sound + j];
      ch.sound[t * size.sound + j] = Math.tanh(a);
    }
    for (let j = 0; j < size.touch; j++) ch.touch[t * size.touch + j] = (j === action ? 1 : 0) + 0.3 * ch.sight[t * size.sight];
    const view = ch.sight.subarray(t * size.sight, t * size.sight + 4);
    latents.heading[t] = view.indexOf(Math.max(...view));
    latents.x[t] = ch.sight[t * size.sight] * 2 + 3;
    latents.nearest_distance_m[t] = ch.sound[t * size.sound] * 5;
  }
  return {
    steps, channelSize: size, channels: ch, latents, episode, hasNext,
    classNames: { heading: ['north', 'east', 'south', 'west'] },
  };
}

/** Whole episodes to train / validation / test in the ratio 6:2:2. */
export function episodeSplit(data: Dataset): DatasetSplit {
  const episodes = data.episode[data.steps - 1] + 1;
  const pick = (lo: number, hi: number) => Int32Array.from(
    Array.from({ length: data.steps }, (_, t) => t).filter((t) => data.episode[t] >= lo * episodes && data.episode[t] < hi * episodes),
  );
  return { train: pick(0, 0.6), validation: pick(0.6, 0.8), test: pick(0.8, 1) };
}

type SpecOverrides = Partial<Omit<LearnerSpec, 'train'>> & { readonly train?: Partial<LearnerSpec['train']> };

/** A learner spec with small defaults, overridable per test. */
export function learnerSpec(overrides: SpecOverrides): LearnerSpec {
  const base: LearnerSpec = {
    name: 'test-learner',
    objective: 'predict',
    input: ['sight'],
    target: ['sound'],
    offset: 0,
    supervisedTargets: ['heading', 'x'],
    encoder: { hidden: [16, 8], activation: 'relu' },
    rule: 'backprop',
    train: { optimizer: 'adam', learningRate: 0.01, batch: 32, epochs: 5, patience: 100, temperature: 0.5 },
  };
  return { ...base, ...overrides, train: { ...base.train, ...overrides.train } };
}
