import * as tf from '@tensorflow/tfjs-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { collect } from '../../src/collect/collector.js';
import { splitByEpisode } from '../../src/collect/split.js';
import { initBackend, trainLearner } from '../../src/learn/index.js';
import type { LifParameters } from '../../src/learn/lif.js';
import { createTower, disposeTower } from '../../src/learn/network.js';
import { layerFiring } from '../../src/learn/spiking-activity.js';
import { spikingRates, type SpikingDynamics } from '../../src/learn/spiking-network.js';
import { OBJECTIVES, type EpochLog, type LearnerSpec, type SpikingEncoderSpec } from '../../src/learn/spec.js';
import { createRng } from '../../src/random.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { loadWorld } from '../../src/world/parse.js';
import { learnerSpec } from './synthetic.js';

beforeAll(() => initBackend('wasm'));

// A small collection from the greenhouse demo world at the default sense sizes.
const data = collect(loadWorld('worlds/greenhouse.yaml'), { policy: 'wander', steps: 1500, episodeSteps: 100 }, DEFAULT_SENSE_SETTINGS, 3);
const split = splitByEpisode(data, { train: 0.6, validation: 0.2, test: 0.2 }, 3);

function spiking(over: Partial<SpikingEncoderSpec> = {}): SpikingEncoderSpec {
  return {
    kind: 'spiking', hidden: [32, 16], steps: 8, dtMs: 1, tauMs: 2, threshold: 1, reset: 'subtract', refractoryMs: 0,
    inputCoding: 'current', surrogate: 'fast-sigmoid', surrogateSlope: 5, ...over,
  };
}

function spec(over: Partial<LearnerSpec> & { encoder?: SpikingEncoderSpec } = {}): LearnerSpec {
  return learnerSpec({
    supervisedTargets: ['wall_ahead', 'heading', 'nearest_distance_m'],
    encoder: spiking(),
    train: { batch: 64, epochs: 5, learningRate: 0.003 },
    ...over,
  });
}

/** Sight rows of the test split. */
function testSight(): { sight: Float32Array; n: number } {
  const size = data.channelSize.sight;
  const sight = new Float32Array(split.test.length * size);
  split.test.forEach((t, i) => sight.set(data.channels.sight.subarray(t * size, (t + 1) * size), i * size));
  return { sight, n: split.test.length };
}

describe('a spiking learner on data from a demo world', () => {
  it.each(OBJECTIVES.filter((o) => o !== 'untrained'))('lowers its training loss under %s', async (objective) => {
    const cross = objective === 'predict'
      ? { input: ['sight', 'motor'] as const, target: ['touch'] as const, offset: 1 as const }
      : { input: ['sight'] as const, target: ['sound'] as const, offset: 0 as const };
    // InfoNCE between two encoders learning together falls more slowly: 8 epochs instead of 5.
    const train = { ...spec().train, epochs: objective === 'contrast' ? 8 : 5 };
    const { encoder, log } = await trainLearner(spec({ objective, input: [...cross.input], target: [...cross.target], offset: cross.offset, train }), data, split, { seed: 3 });
    encoder.dispose();
    // Common practice: a working training signal lowers the loss by > 10 % in a few epochs.
    expect(log[log.length - 1].trainLoss).toBeLessThan(0.9 * log[0].trainLoss);
    expect(log.every((l) => Number.isFinite(l.validationLoss))).toBe(true);
  });

  it.each([
    { rule: 'feedback-alignment', coding: 'current' },
    { rule: 'direct-feedback-alignment', coding: 'current' },
    { rule: 'backprop', coding: 'poisson' },
  ] as const)('lowers its loss predicting sound from sight under $rule with $coding input', async ({ rule, coding }) => {
    // Rate-coded input carries less per step than a held current: 16 steps instead of 8.
    const encoder = spiking({ inputCoding: coding, steps: coding === 'poisson' ? 16 : 8 });
    const trained = await trainLearner(spec({ rule, encoder }), data, split, { seed: 3, alignEvery: 5 });
    const { log } = trained;
    trained.encoder.dispose();
    expect(log[log.length - 1].trainLoss).toBeLessThan(0.9 * log[0].trainLoss);
    // Angles against backprop through time for W_1, W_2 and the head, as for rate encoders; the head's is 0° but for rounding.
    if (rule !== 'backprop') {
      expect(log[4].alignmentDeg).toHaveLength(3);
      expect(log[4].alignmentDeg[2]).toBeLessThan(0.1);
      expect(log[4].alignmentDeg[0]).toBeGreaterThan(1);
    }
  });

  it('logs the firing rate in Hz and the silent fraction of each hidden layer every epoch; rate encoders log none', async () => {
    const { encoder, log } = await trainLearner(spec({ train: { ...spec().train, epochs: 2 } }), data, split, { seed: 3 });
    encoder.dispose();
    for (const entry of log) {
      expect(entry.firing?.rateHz).toHaveLength(2);
      expect(entry.firing?.silentFraction).toHaveLength(2);
      // At Δt = 1 ms a unit fires at most once a step: 0..1000 Hz.
      for (const r of entry.firing?.rateHz ?? []) expect(r > 0 && r <= 1000).toBe(true);
      for (const f of entry.firing?.silentFraction ?? []) expect(f >= 0 && f <= 1).toBe(true);
    }
    const mlp = await trainLearner(learnerSpec({ train: { batch: 64, epochs: 1 } }), data, split, { seed: 3 });
    mlp.encoder.dispose();
    expect(mlp.log[0].firing).toBeUndefined();
  });
});

describe('determinism', () => {
  it.each(['current', 'poisson'] as const)('gives bit-identical features for the same seed (%s input), different ones for another seed', async (coding) => {
    const run = async (seed: number) => {
      const { encoder } = await trainLearner(spec({ encoder: spiking({ inputCoding: coding }), train: { ...spec().train, epochs: 2 } }), data, split, { seed });
      const { sight, n } = testSight();
      const f = encoder.features({ sight }, n);
      encoder.dispose();
      return Buffer.from(f.buffer);
    };
    const [a, b, c] = [await run(5), await run(5), await run(6)];
    expect(a.equals(b)).toBe(true);
    expect(a.equals(c)).toBe(false);
  });

  it('makes rate-coded features a function of each row alone, whatever rows share the call', async () => {
    const { encoder } = await trainLearner(spec({ encoder: spiking({ inputCoding: 'poisson' }), train: { ...spec().train, epochs: 1 } }), data, split, { seed: 5 });
    const { sight, n } = testSight();
    const size = data.channelSize.sight;
    const all = encoder.features({ sight }, n);
    const last = encoder.features({ sight: sight.subarray((n - 1) * size) }, 1);
    encoder.dispose();
    expect(Array.from(last)).toEqual(Array.from(all.subarray((n - 1) * encoder.featureSize)));
  });
});

describe('tensors', () => {
  it('leaks none across epochs, and what remains after training is the encoder alone', async () => {
    const before = tf.memory().numTensors;
    const counts: number[] = [];
    const { encoder } = await trainLearner(spec({ objective: 'contrast', rule: 'direct-feedback-alignment', encoder: spiking({ inputCoding: 'poisson' }), train: { ...spec().train, epochs: 4 } }), data, split, {
      seed: 1, onEpoch: (_log: EpochLog) => counts.push(tf.memory().numTensors),
    });
    // From epoch 2 on the live set is fixed: weights, feedback, optimiser moments, best-weight copy.
    expect(counts[2]).toBe(counts[1]);
    expect(counts[3]).toBe(counts[1]);
    expect(tf.memory().numTensors).toBe(before + 4); // W and b of the encoder's 2 layers
    const { sight, n } = testSight();
    encoder.features({ sight }, n);
    expect(tf.memory().numTensors).toBe(before + 4);
    encoder.dispose();
    expect(tf.memory().numTensors).toBe(before);
  });

  it('allocates the same tensors for 4 time steps as for 25: none per step', () => {
    const tower = createTower({ channels: ['sight'], inputWidth: 6, hidden: [5, 4], outputWidth: 0, extraWidth: 0 }, null,
      { encoder: createRng(1, 'test'), head: createRng(1, 'test') }, (rng, fanIn, fanOut) => Float32Array.from({ length: fanIn * fanOut }, () => rng()));
    const x = tf.ones([3, 6]) as tf.Tensor2D;
    const allocated = (steps: number) => {
      const d: SpikingDynamics = { lif: { steps, beta: 0.8, gain: 0.2, threshold: 1, reset: 'subtract', refractorySteps: 0 }, surrogate: { name: 'arctan', slope: 2 }, coding: 'current', dtMs: 1 };
      const before = tf.memory().numTensors;
      let during = 0;
      tf.tidy(() => {
        spikingRates(tower, x, d);
        during = tf.memory().numTensors - before;
      });
      expect(tf.memory().numTensors).toBe(before);
      return during;
    };
    expect(allocated(25)).toBe(allocated(4));
    disposeTower(tower);
    x.dispose();
  });
});

describe('layer firing', () => {
  it('counts a layer of two silent units and two units firing every step as 500 Hz at Δt = 1 ms, half silent', () => {
    // W = 0 and biases −5, −5, +100, +100: with gain 0.5 and θ = 1 the last two cross every step (hand-worked).
    const tower = createTower({ channels: ['sight'], inputWidth: 3, hidden: [4], outputWidth: 0, extraWidth: 0 }, null,
      { encoder: createRng(1, 'test'), head: createRng(1, 'test') }, (_rng, fanIn, fanOut) => new Float32Array(fanIn * fanOut));
    tower.encoder[0].b.assign(tf.tensor1d([-5, -5, 100, 100]));
    const lif: LifParameters = { steps: 10, beta: 0.5, gain: 0.5, threshold: 1, reset: 'zero', refractorySteps: 0 };
    const d: SpikingDynamics = { lif, surrogate: { name: 'fast-sigmoid', slope: 5 }, coding: 'current', dtMs: 1 };
    const firing = layerFiring(tower, 2500, (start, end) => tf.zeros([end - start, 3]), d); // 2500 rows: three chunks
    expect(firing).toEqual({ rateHz: [500], silentFraction: [0.5] });
    disposeTower(tower);
  });
});
