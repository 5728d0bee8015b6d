import * as tf from '@tensorflow/tfjs-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { initBackend, trainLearner } from '../../src/learn/index.js';
import { createTower, disposeTower, towerVariables } from '../../src/learn/network.js';
import { bindObjective } from '../../src/learn/bound-objective.js';
import { OBJECTIVE_REGISTRY } from '../../src/learn/objectives.js';
import type { LearnerSpec } from '../../src/learn/spec.js';
import { towerStreams } from '../../src/learn/streams.js';
import { episodeSplit, learnerSpec, syntheticDataset } from './synthetic.js';

// Common random numbers, the variance-reduction technique of simulation studies: learners
// compared within a seed share every random draw their settings allow, so a paired difference
// holds the effect of the settings and not the luck of the draw.

beforeAll(() => initBackend('wasm'));

const data = syntheticDataset(800);
const split = episodeSplit(data);

/** Test-split features of a learner trained on the synthetic dataset with seed 3. */
async function testFeatures(spec: LearnerSpec): Promise<Float32Array> {
  const { encoder } = await trainLearner(spec, data, split, { seed: 3 });
  const size = data.channelSize.sight;
  const sight = new Float32Array(split.test.length * size);
  split.test.forEach((t, i) => sight.set(data.channels.sight.subarray(t * size, (t + 1) * size), i * size));
  const features = encoder.features({ sight }, split.test.length);
  encoder.dispose();
  return features;
}

const bitIdentical = (a: Float32Array, b: Float32Array) => Buffer.from(a.buffer).equals(Buffer.from(b.buffer));

describe('two identical learners under different names', () => {
  it.each([
    ['predict', 'feedback-alignment'],
    ['contrast', 'direct-feedback-alignment'],
    ['forecast', 'backprop'],
  ] as const)('produce bit-identical features (%s, %s, 3 epochs)', async (objective, rule) => {
    // Initial weights, feedback matrices and batch order all reach the features after training.
    const settings = { objective, rule, input: ['sight'], target: ['sound'], train: { epochs: 3 } } as const;
    const a = await testFeatures(learnerSpec({ ...settings, name: 'sound-from-sight' }));
    const b = await testFeatures(learnerSpec({ ...settings, name: 'a-renamed-copy' }));
    expect(a.length).toBe(split.test.length * 8);
    expect(bitIdentical(a, b)).toBe(true);
  });
});

describe('learners whose encoders read the same channels with the same widths and activation', () => {
  it('start from identical encoder weights whatever their objective and rule', async () => {
    // With SGD at a learning rate of 1e-20 no float32 weight moves, so each learner's
    // features are those of its initial encoder; `untrained` never moves at all.
    const frozen = { optimizer: 'sgd', learningRate: 1e-20, epochs: 1 } as const;
    const untrained = await testFeatures(learnerSpec({ name: 'floor', objective: 'untrained' }));
    const others = [
      learnerSpec({ name: 'p', objective: 'predict', rule: 'feedback-alignment', train: frozen }),
      learnerSpec({ name: 'r', objective: 'reconstruct', train: frozen }),
      learnerSpec({ name: 'c', objective: 'contrast', rule: 'direct-feedback-alignment', train: frozen }),
      learnerSpec({ name: 's', objective: 'supervised', train: frozen }),
    ];
    for (const spec of others) expect(bitIdentical(await testFeatures(spec), untrained)).toBe(true);
  });

  it('differ from encoders of other widths or activation', async () => {
    const base = await testFeatures(learnerSpec({ objective: 'untrained' }));
    const tanh = await testFeatures(learnerSpec({ objective: 'untrained', encoder: { hidden: [16, 8], activation: 'tanh' } }));
    const wider = await testFeatures(learnerSpec({ objective: 'untrained', encoder: { hidden: [32, 8], activation: 'relu' } }));
    expect(bitIdentical(base, tanh)).toBe(false);
    expect(bitIdentical(base, wider)).toBe(false);
  });
});

describe('the two towers of a contrast learner', () => {
  it('draw different heads though their heads have the same shape', () => {
    // Tower 0 reads sight, tower 1 sound; both heads map the last hidden layer (8) to an 8-wide embedding.
    const spec = learnerSpec({ objective: 'contrast', input: ['sight'], target: ['sound'] });
    const shapes = bindObjective(OBJECTIVE_REGISTRY.contrast, spec, data).towers;
    const towers = shapes.map((shape, i) => createTower(shape, 'relu', towerStreams(3, shape, 'relu', i)));
    const [head0, head1] = towers.map((t) => Array.from(t.head!.W.dataSync()));
    expect(head0).toHaveLength(64);
    expect(head1).toHaveLength(64);
    expect(head0).not.toEqual(head1);
    const before = tf.memory().numTensors;
    const variables = towers.flatMap(towerVariables).length; // W and b of 2 hidden layers and a head, per tower
    towers.forEach(disposeTower);
    expect(variables).toBe(12);
    expect(tf.memory().numTensors).toBe(before - variables);
  });
});
