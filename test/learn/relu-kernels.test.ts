import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { biasRelu, reluBackward } from '../../src/learn/relu-kernels.js';
import { createRng, normal } from '../../src/random.js';

/** Values as text that tells −0 from 0 and any NaN from a number, so "same" means same value to the sign of zero. */
const exact = (t: tf.Tensor) => Array.from(t.dataSync(), (v) => (Number.isNaN(v) ? 'NaN' : Object.is(v, -0) ? '-0' : String(v)));

/** A [rows, cols] matrix of normal draws with the awkward values placed among them. */
function matrix(rows: number, cols: number, seed: number): tf.Tensor2D {
  const rng = createRng(seed, 'test');
  const special = [0, -0, NaN, Infinity, -Infinity, 1e-40, -1e-40];
  return tf.tensor2d(Float32Array.from({ length: rows * cols }, (_, i) => (i % 5 === 0 ? special[(i / 5) % special.length] : normal(rng))), [rows, cols]);
}

describe.each(['wasm', 'cpu'] as const)('relu kernels on %s', (backend) => {
  // 7 columns leave a remainder after the 4-wide vectors of the wasm loops; 256 × 128 is a layer's batch.
  it.each([[3, 7], [256, 128], [1, 1]])('give the bits of tf.add and tf.relu for a [%i, %i] layer, at 0, −0, NaN and ±∞ too', async (rows, cols) => {
    await initBackend(backend);
    const before = tf.memory().numTensors;
    const [ours, reference] = tf.tidy(() => {
      const a = matrix(rows, cols, 1);
      const b = tf.tensor1d(Float32Array.from({ length: cols }, (_, j) => [0.5, -0, -2, NaN][j % 4]));
      const pre = tf.add(a, b) as tf.Tensor2D;
      return [biasRelu(a, b).map(exact), [pre, tf.relu(pre)].map(exact)];
    });
    expect(ours).toEqual(reference);
    expect(tf.memory().numTensors).toBe(before);
  });

  it.each([[3, 7], [256, 128]])('give the bits of g ⊙ tf.step(pre) for [%i, %i]', async (rows, cols) => {
    await initBackend(backend);
    const [ours, reference] = tf.tidy(() => {
      const g = matrix(rows, cols, 2);
      const pre = matrix(rows, cols, 3);
      return [exact(reluBackward(g, pre)), exact(tf.mul(g, tf.step(pre)))];
    });
    expect(ours).toEqual(reference);
  });

  it('pass the error only where the unit was active: g = [1, 2, 3], pre = [−1, 0, 4] gives [0, 0, 3] (worked by hand)', async () => {
    await initBackend(backend);
    const delta = tf.tidy(() => Array.from(reluBackward(tf.tensor2d([[1, 2, 3]]), tf.tensor2d([[-1, 0, 4]])).dataSync()));
    expect(delta).toEqual([0, 0, 3]);
  });

  it('refuse a bias that does not match the columns, naming both shapes', async () => {
    await initBackend(backend);
    expect(() => tf.tidy(() => biasRelu(tf.zeros([2, 3]), tf.zeros([2])))).toThrow('biasRelu: expected [rows, cols] and [cols], got [2, 3] and [2]');
  });
});
