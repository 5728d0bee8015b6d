import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { createOptimizer } from '../../src/learn/optimizers.js';
import type { LearnerSpec } from '../../src/learn/spec.js';
import { createRng, normal } from '../../src/random.js';

const SHAPES = [[7, 5], [5], [5, 3], [3]];

/** Variables and five steps of gradients drawn from a fixed seed, some gradients zero or tiny. */
function problem(): { initial: Float32Array[]; steps: Float32Array[][] } {
  const rng = createRng(21, 'test');
  const draw = (shape: number[], scale: number) => Float32Array.from({ length: shape.reduce((a, b) => a * b, 1) }, (_, i) => (i % 7 === 0 ? 0 : normal(rng) * scale));
  return {
    initial: SHAPES.map((s) => draw(s, 1)),
    steps: Array.from({ length: 5 }, (_, k) => SHAPES.map((s) => draw(s, 10 ** (k - 3)))),
  };
}

/** Final weights after applying every step with `apply`, as flat arrays. */
function train(apply: (vars: tf.Variable[], grads: tf.Tensor[]) => void): number[][] {
  const { initial, steps } = problem();
  const vars = tf.tidy(() => initial.map((values, i) => tf.variable(tf.tensor(values, SHAPES[i]))));
  for (const step of steps) tf.tidy(() => apply(vars, step.map((g, i) => tf.tensor(g, SHAPES[i]))));
  const out = vars.map((v) => Array.from(v.dataSync()));
  tf.dispose(vars);
  return out;
}

const settings = (optimizer: 'adam' | 'sgd', learningRate: number) => ({ optimizer, learningRate } as LearnerSpec['train']);

describe.each(['wasm', 'cpu'] as const)('one-kernel optimisers on %s', (backend) => {
  it.each([['adam', 0.01], ['sgd', 0.1]] as const)('%s gives the weights of tfjs\'s own optimiser bit for bit over 5 steps', async (name, rate) => {
    // The reference is tfjs-core's tf.train optimiser, an independent implementation of the
    // same float32 operations; gradients span 1e-3..10 and include exact zeros.
    await initBackend(backend);
    const reference = tf.train[name](rate);
    const expected = train((vars, grads) => reference.applyGradients(vars.map((v, i) => ({ name: v.name, tensor: grads[i] }))));
    reference.dispose();
    const before = tf.memory().numTensors;
    const ours = createOptimizer(settings(name, rate));
    const actual = train((vars, grads) => ours.applyGradients(vars, grads));
    ours.dispose();
    expect(actual).toEqual(expected);
    expect(tf.memory().numTensors).toBe(before); // moments freed with the optimiser
  });
});

describe('Adam\'s first step', () => {
  it('moves every weight with a non-zero gradient by the learning rate against its sign (Kingma & Ba 2015, §2.1)', async () => {
    // After one step m̂ = g and v̂ = g², so Δw = −lr·g / (|g| + ε) ≈ −lr·sign(g) whatever |g| is.
    await initBackend('wasm');
    const w = tf.tidy(() => tf.variable(tf.tensor1d([1, 1, 1, 1])));
    const adam = createOptimizer(settings('adam', 0.001));
    tf.tidy(() => adam.applyGradients([w], [tf.tensor1d([1e-3, -5, 20, 0])]));
    const moved = Array.from(w.dataSync()).map((v) => v - 1);
    adam.dispose();
    w.dispose();
    [-0.001, 0.001, -0.001].forEach((d, i) => expect(moved[i]).toBeCloseTo(d, 6));
    expect(moved[3]).toBe(0);
  });
});
