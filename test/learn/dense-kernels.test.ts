import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { columnSums, matMulT, transpose2d } from '../../src/learn/dense-kernels.js';
import { createRng, normal } from '../../src/random.js';

/** A [rows, cols] matrix of normal draws spanning several magnitudes, so summation order shows in the bits. */
function matrix(rows: number, cols: number, seed: number): tf.Tensor2D {
  const rng = createRng(seed, 'test');
  return tf.tensor2d(Float32Array.from({ length: rows * cols }, (_, i) => normal(rng) * 10 ** ((i % 5) - 2)), [rows, cols]);
}

const values = (t: tf.Tensor) => Array.from(t.dataSync());

describe.each(['wasm', 'cpu'] as const)('dense-layer kernels on %s', (backend) => {
  it.each([[1, 1], [3, 70], [256, 128], [33, 47]])('transpose a [%i, %i] matrix exactly as tf.transpose does', async (rows, cols) => {
    await initBackend(backend);
    const [ours, reference] = tf.tidy(() => {
      const x = matrix(rows, cols, rows);
      return [transpose2d(x), tf.transpose(x)].map((t) => ({ shape: t.shape, data: values(t) }));
    });
    expect(ours).toEqual(reference);
  });

  it.each([[1, 4], [256, 128], [100, 3]])('sum the columns of a [%i, %i] matrix to the bits of tf.sum(x, 0)', async (rows, cols) => {
    await initBackend(backend);
    const before = tf.memory().numTensors;
    const [ours, reference] = tf.tidy(() => {
      const x = matrix(rows, cols, 7);
      return [columnSums(x), tf.sum(x, 0)].map((t) => ({ shape: t.shape, data: values(t) }));
    });
    expect(ours).toEqual(reference);
    expect(tf.memory().numTensors).toBe(before);
  });

  it('multiply with either operand transposed: [[1,2],[3,4]]ᵀ·[[1,0],[0,2]] = [[1,6],[2,8]] (worked by hand)', async () => {
    await initBackend(backend);
    const a = [[1, 2], [3, 4]];
    const b = [[1, 0], [0, 2]];
    const product = (tA: boolean, tB: boolean) => tf.tidy(() => values(matMulT(tf.tensor2d(a), tf.tensor2d(b), tA, tB)));
    expect(product(true, false)).toEqual([1, 6, 2, 8]);
    expect(product(false, true)).toEqual([1, 4, 3, 8]); // a·bᵀ, b symmetric: a·b
    expect(product(true, true)).toEqual([1, 6, 2, 8]);
  });
});
