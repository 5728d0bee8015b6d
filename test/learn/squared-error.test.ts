import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { meanSquaredDifference } from '../../src/learn/squared-error.js';
import { createRng, normal } from '../../src/random.js';

const bits = (t: tf.Tensor) => Buffer.from(t.dataSync().buffer).toString('hex');

/** A [rows, cols] matrix of normal draws spanning several magnitudes, so rounding shows in the bits. */
function matrix(rows: number, cols: number, seed: number): tf.Tensor2D {
  const rng = createRng(seed, 'test');
  return tf.tensor2d(Float32Array.from({ length: rows * cols }, (_, i) => normal(rng) * 10 ** ((i % 5) - 2)), [rows, cols]);
}

describe.each(['wasm', 'cpu'] as const)('mean squared difference on %s', (backend) => {
  it('is mean((a − b)²) with gradients 2(a − b)/n and 2(b − a)/n: a = [[1, 2]], b = [[0, 4]] gives 2.5, [1, −2], [−1, 2] (worked by hand)', async () => {
    await initBackend(backend);
    const [value, dA, dB] = tf.tidy(() => {
      const { value: v, grads } = tf.valueAndGrads((a: tf.Tensor, b: tf.Tensor) => meanSquaredDifference(a as tf.Tensor2D, b as tf.Tensor2D))([tf.tensor2d([[1, 2]]), tf.tensor2d([[0, 4]])]);
      return [v, ...grads].map((t) => Array.from(t.dataSync()));
    });
    expect(value).toEqual([2.5]);
    expect(dA).toEqual([1, -2]);
    expect(dB).toEqual([-1, 2]);
  });

  it.each([[256, 48], [3, 7]])('gives autodiff\'s bits through tf.mean and tf.squaredDifference for [%i, %i], under an outer factor 3 too', async (rows, cols) => {
    await initBackend(backend);
    const before = tf.memory().numTensors;
    const run = (loss: (a: tf.Tensor2D, b: tf.Tensor2D) => tf.Scalar) => tf.tidy(() => {
      const { value, grads } = tf.valueAndGrads((a: tf.Tensor, b: tf.Tensor) => tf.mul(loss(a as tf.Tensor2D, b as tf.Tensor2D), 3) as tf.Scalar)([matrix(rows, cols, 1), matrix(rows, cols, 2)]);
      return [value, ...grads].map(bits);
    });
    expect(run(meanSquaredDifference)).toEqual(run((a, b) => tf.mean(tf.squaredDifference(a, b))));
    expect(tf.memory().numTensors).toBe(before);
  });
});
