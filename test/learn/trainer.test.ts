import * as tf from '@tensorflow/tfjs-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { initBackend, LearnerDivergedError, trainLearner } from '../../src/learn/index.js';
import { TrainingStatistics } from '../../src/learn/examples.js';
import { heNormal } from '../../src/learn/init.js';
import { meanSquaredError } from '../../src/learn/losses.js';
import { disposeTower, forward } from '../../src/learn/network.js';
import { bindObjective } from '../../src/learn/bound-objective.js';
import { OBJECTIVE_REGISTRY } from '../../src/learn/objectives.js';
import { trainNetwork } from '../../src/learn/trainer.js';
import { OBJECTIVES, RULES, type EpochLog } from '../../src/learn/spec.js';
import { createRng } from '../../src/random.js';
import { episodeSplit, learnerSpec, syntheticDataset } from './synthetic.js';

beforeAll(() => initBackend('wasm'));

const data = syntheticDataset(800);
const split = episodeSplit(data);

/** Sight rows of the test split, [n, 12]. */
function testInputs(): { sight: Float32Array; n: number } {
  const size = data.channelSize.sight;
  const sight = new Float32Array(split.test.length * size);
  split.test.forEach((t, i) => sight.set(data.channels.sight.subarray(t * size, (t + 1) * size), i * size));
  return { sight, n: split.test.length };
}

describe.each(OBJECTIVES.filter((o) => o !== 'untrained'))('objective %s', (objective) => {
  it.each(RULES)('lowers its training loss under %s', async (rule) => {
    // Hand-made data with a known structure (see synthetic.ts); the loss must fall by a
    // clear margin over 6 epochs (common practice: a working signal drops it by > 10 %).
    const spec = learnerSpec({ objective, rule, input: ['sight'], target: ['sound'], train: { epochs: 6 } });
    const { encoder, log, bestEpoch } = await trainLearner(spec, data, split, { seed: 1 });
    encoder.dispose();
    expect(log).toHaveLength(6);
    const lowest = Math.min(...log.map((l) => l.validationLoss));
    expect(log[bestEpoch - 1].validationLoss).toBe(lowest); // the restored weights are the best epoch's
    expect(log[5].trainLoss).toBeLessThan(0.9 * log[0].trainLoss);
    expect(log[5].alignmentDeg).toHaveLength(rule === 'backprop' ? 0 : (objective === 'contrast' ? 6 : 3));
  });
});

describe('predict at offset 1', () => {
  it('lowers its loss predicting next touch from sight + motor', async () => {
    const spec = learnerSpec({ input: ['motor', 'sight'], target: ['touch'], offset: 1, train: { epochs: 6 } });
    const { encoder, log } = await trainLearner(spec, data, split, { seed: 1 });
    expect(encoder.input).toEqual(['sight', 'motor']); // CHANNELS order, whatever the spec's order
    encoder.dispose();
    expect(log[5].trainLoss).toBeLessThan(0.9 * log[0].trainLoss);
  });
});

describe('untrained', () => {
  it('keeps the initial weights: features equal a hand-computed pass through He-normal draws from the seed', async () => {
    const spec = learnerSpec({ objective: 'untrained', encoder: { hidden: [5], activation: 'relu' } });
    const { encoder, log, bestEpoch } = await trainLearner(spec, data, split, { seed: 4 });
    expect(log).toHaveLength(0);
    expect(bestEpoch).toBe(0);
    const { sight, n } = testInputs();
    const features = encoder.features({ sight }, n);
    encoder.dispose();
    // Reference: standardise with train-split statistics, then relu(x·W) with W from
    // the documented stream of an encoder reading sight (12 wide) with hidden [5] and relu
    // (src/random.ts; biases start at 0), all in float64.
    const size = 12;
    const W = heNormal(createRng(4, 'init', 'encoder', 'sight', 12, '5', 'relu'), size, 5);
    const mean = new Float64Array(size);
    const sq = new Float64Array(size);
    split.train.forEach((t) => { for (let i = 0; i < size; i++) mean[i] += data.channels.sight[t * size + i] / split.train.length; });
    split.train.forEach((t) => { for (let i = 0; i < size; i++) sq[i] += (data.channels.sight[t * size + i] - mean[i]) ** 2 / split.train.length; });
    for (let r = 0; r < n; r++) {
      for (let j = 0; j < 5; j++) {
        let a = 0;
        for (let i = 0; i < size; i++) a += ((sight[r * size + i] - mean[i]) / Math.sqrt(sq[i])) * W[i * 5 + j];
        expect(features[r * 5 + j]).toBeCloseTo(Math.max(0, a), 4);
      }
    }
  });
});

describe('determinism and backends', () => {
  it('gives bit-identical features for the same seed on cpu, different ones for another seed', async () => {
    await initBackend('cpu');
    const spec = learnerSpec({ rule: 'feedback-alignment', train: { epochs: 2 } });
    const run = async (seed: number) => {
      const { encoder } = await trainLearner(spec, data, split, { seed });
      const { sight, n } = testInputs();
      const f = encoder.features({ sight }, n);
      encoder.dispose();
      return f;
    };
    const [a, b, c] = [await run(5), await run(5), await run(6)];
    await initBackend('wasm');
    expect(Buffer.from(a.buffer).equals(Buffer.from(b.buffer))).toBe(true);
    expect(Buffer.from(a.buffer).equals(Buffer.from(c.buffer))).toBe(false);
  });

  it('gives the same losses on cpu and wasm to float tolerance', async () => {
    const spec = learnerSpec({ objective: 'contrast', target: ['sound'], train: { epochs: 2 } });
    const losses = async (backend: 'cpu' | 'wasm') => {
      await initBackend(backend);
      const { encoder, log } = await trainLearner(spec, data, split, { seed: 7 });
      encoder.dispose();
      return log.flatMap((l) => [l.trainLoss, l.validationLoss]);
    };
    const cpu = await losses('cpu');
    const wasm = await losses('wasm');
    // float32 sums in a different order drift by ~1e-7 relative per op (STACK.md saw 6e-8); allow 1e-4.
    wasm.forEach((v, i) => expect(Math.abs(v - cpu[i]) / Math.abs(cpu[i])).toBeLessThan(1e-4));
  });
});

describe('failures and resources', () => {
  it('throws LearnerDivergedError naming learner, loss and epoch, freeing every tensor', async () => {
    const before = tf.memory().numTensors;
    const spec = learnerSpec({ name: 'runaway', train: { optimizer: 'sgd', learningRate: 1e30, epochs: 3 } });
    const run = trainLearner(spec, data, split, { seed: 1 });
    await expect(run).rejects.toBeInstanceOf(LearnerDivergedError);
    await expect(trainLearner(spec, data, split, { seed: 1 })).rejects.toThrow(/^learner 'runaway': train loss became (NaN|Infinity) at epoch 1$/);
    expect(tf.memory().numTensors).toBe(before);
  });

  it.each(['direct-feedback-alignment', 'kolen-pollack'] as const)('leaks no tensors across an epoch, a feature extraction, or a whole run once disposed (%s)', async (rule) => {
    // Kolen–Pollack replaces its feedback matrices and the forward weights at every step.
    const before = tf.memory().numTensors;
    const counts: number[] = [];
    const spec = learnerSpec({ objective: 'contrast', rule, train: { epochs: 4 } });
    const { encoder } = await trainLearner(spec, data, split, {
      seed: 1, onEpoch: (_log: EpochLog) => counts.push(tf.memory().numTensors),
    });
    // From epoch 2 on, the live set is fixed: weights, feedback, optimiser moments, best-weight copy
    // (batches are uploaded step by step and freed with the step).
    expect(counts[2]).toBe(counts[1]);
    expect(counts[3]).toBe(counts[1]);
    // What remains after training is the encoder alone: W and b of each of its 2 layers.
    expect(tf.memory().numTensors).toBe(before + 4);
    const { sight, n } = testInputs();
    encoder.features({ sight }, n);
    expect(tf.memory().numTensors).toBe(before + 4);
    encoder.dispose();
    expect(tf.memory().numTensors).toBe(before);
  });

  it('extracts [n, featureSize] features in chunks, and rejects a wrongly sized channel', async () => {
    const { encoder } = await trainLearner(learnerSpec({ train: { epochs: 1 } }), data, split, { seed: 1 });
    const n = 5000; // more than one 4096-row chunk
    const sight = Float32Array.from({ length: n * 12 }, (_, i) => data.channels.sight[i % data.channels.sight.length]);
    const f = encoder.features({ sight }, n);
    expect(encoder.featureSize).toBe(8);
    expect(f).toHaveLength(n * 8);
    // Rows repeat every 800 steps, so do their features, across the chunk boundary.
    expect(Array.from(f.subarray(4100 * 8, 4101 * 8))).toEqual(Array.from(f.subarray(100 * 8, 101 * 8)));
    expect(() => encoder.features({ sight: sight.subarray(1) }, n)).toThrow("features: channel 'sight' has 59999 values, expected 5000 × 12");
    expect(() => encoder.features({}, n)).toThrow("features: input channel 'sight' is missing");
    encoder.dispose();
  });

  it('rejects a spec that lacks what its objective needs', async () => {
    await expect(trainLearner(learnerSpec({ name: 'x', target: [] }), data, split, { seed: 1 }))
      .rejects.toThrow("learner 'x': objective 'predict' needs at least one target channel");
  });

  it('rejects a patience below 1, which the config schema also forbids', async () => {
    await expect(trainLearner(learnerSpec({ name: 'x', train: { patience: 0 } }), data, split, { seed: 1 }))
      .rejects.toThrow("learner 'x': patience must be a positive integer, got 0");
  });
});

describe('early stopping', () => {
  it('stops after `patience` epochs without a lower validation loss', async () => {
    // With a learning rate of 1e-20 no float32 weight can change, so the validation loss
    // repeats exactly: epoch 1 is best and epochs 2 and 3 exhaust a patience of 2.
    const spec = learnerSpec({ train: { optimizer: 'sgd', learningRate: 1e-20, epochs: 10, patience: 2 } });
    const { encoder, log, bestEpoch } = await trainLearner(spec, data, split, { seed: 1 });
    encoder.dispose();
    expect(log.map((l) => l.epoch)).toEqual([1, 2, 3]);
    expect(bestEpoch).toBe(1);
    expect(log[2].validationLoss).toBe(log[0].validationLoss);
  });
});

describe('forecast examples', () => {
  it('pair step t with the action recorded at t + 1 (the action taken between t and t + 1)', () => {
    const spec = learnerSpec({ objective: 'forecast' });
    const signal = bindObjective(OBJECTIVE_REGISTRY.forecast, spec, data).signal!;
    const steps = split.train.subarray(0, 60);
    const examples = signal.examples(new TrainingStatistics(data, split.train), steps);
    const rows = steps.filter((t) => data.hasNext[t] === 1);
    expect(examples.n).toBe(rows.length);
    expect(examples.n).toBeLessThan(steps.length); // an episode boundary falls inside
    rows.forEach((t, i) => {
      expect(Array.from(examples.extra!.data.subarray(i * 5, i * 5 + 5))).toEqual(Array.from(data.channels.motor.subarray((t + 1) * 5, (t + 2) * 5)));
    });
  });
});

describe('restoring the best weights', () => {
  it('leaves the network at the validation loss logged for the best epoch', async () => {
    // A large step size makes the validation loss wander, so the best epoch is not the last.
    const spec = learnerSpec({ train: { learningRate: 0.2, epochs: 8 } });
    const net = await trainNetwork(spec, data, split, { seed: 2 });
    expect(net.bestEpoch).toBeLessThan(net.log.length);
    const examples = net.objective.signal!.examples(net.stats, split.validation);
    const loss = tf.tidy(() => {
      const x = tf.tensor2d(examples.inputs[0].data, [examples.n, examples.inputs[0].cols]);
      const y = tf.tensor2d(examples.target!.data, [examples.n, examples.target!.cols]);
      return meanSquaredError(forward(net.towers[0], x, null), y).dataSync()[0];
    });
    net.towers.forEach(disposeTower);
    // Logged as a batch-size-weighted mean of float32 batch losses: equal to ~1e-6.
    expect(loss).toBeCloseTo(net.log[net.bestEpoch - 1].validationLoss, 5);
  });
});
