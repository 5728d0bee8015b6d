import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { createRng, normal } from '../../src/random.js';

/** A [rows, cols] matrix of normal draws spanning several magnitudes, so summation order shows in the bits. */
function matrix(rows: number, cols: number, seed: number): tf.Tensor2D {
  const rng = createRng(seed, 'test');
  return tf.tensor2d(Float32Array.from({ length: rows * cols }, (_, i) => normal(rng) * 10 ** ((i % 5) - 2)), [rows, cols]);
}

/**
 * C = A·B summed as XNNPACK's float32 GEMM microkernels sum it (XNNPACK, src/f32-gemm:
 * one accumulator per element from +0, a[i,k]·b[k,j] rounded to float32 and added for
 * k = 0 … K−1 in order), in plain JavaScript with every operation rounded to float32.
 */
function sequentialProduct(a: Float32Array, b: Float32Array, m: number, k: number, n: number): Float32Array {
  const c = new Float32Array(m * n);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let p = 0; p < k; p++) sum = Math.fround(sum + Math.fround(a[i * k + p] * b[p * n + j]));
      c[i * n + j] = sum;
    }
  }
  return c;
}

const bits = (t: tf.Tensor) => Buffer.from(t.dataSync().buffer).toString('hex');

describe('matrix products on wasm (matmul.wat)', () => {
  // Shapes of the dense layers (batch 256, widths 160/128/64/48) and ones with edges in
  // every direction: rows not a multiple of 4, columns not a multiple of 8 or 4, empty sums.
  const shapes = [[256, 160, 128], [160, 256, 128], [256, 128, 48], [37, 19, 13], [5, 7, 3], [256, 64, 5], [3, 2, 1], [4, 0, 8]];

  // With k = 0 the stock kernel leaves its output unwritten (whatever the heap held), where an
  // empty sum is 0: that shape is checked against the reference below only.
  it.each(shapes.filter(([, k]) => k > 0))('give the bits of the stock XNNPACK product for [%i, %i]·[%i, …]', async (m, k, n) => {
    await initBackend('wasm');
    const [ours, stock] = tf.tidy(() => {
      const a = matrix(m, k, m + k);
      const b = matrix(k, n, n);
      // The fused kernel (no bias, linear) still runs tfjs-backend-wasm's own XNNPACK path.
      return [tf.matMul(a, b), tf.fused.matMul({ a, b })].map(bits);
    });
    expect(ours).toBe(stock);
  });

  it.each(shapes)('sum each element in order in float32, for aᵀ read in place too: [%i, %i]·[%i, …]', async (m, k, n) => {
    await initBackend('wasm');
    const before = tf.memory().numTensors;
    const [plain, transposed, reference] = tf.tidy(() => {
      const a = matrix(m, k, 3);
      const b = matrix(k, n, 4);
      const expected = tf.tensor2d(sequentialProduct(a.dataSync() as Float32Array, b.dataSync() as Float32Array, m, k, n), [m, n]);
      return [tf.matMul(a, b), tf.matMul(tf.transpose(a), b, true, false), expected].map((t) => ({ shape: t.shape, bits: bits(t) }));
    });
    expect(plain).toEqual(reference);
    expect(transposed).toEqual(reference);
    expect(tf.memory().numTensors).toBe(before);
  });

  it('leave batched products to the stock kernel: [2, 2, 3]·[2, 3, 1] (worked by hand)', async () => {
    await initBackend('wasm');
    const product = tf.tidy(() => Array.from(tf.matMul(tf.tensor3d([1, 2, 3, 4, 5, 6, 1, 0, 0, 0, 1, 0], [2, 2, 3]), tf.tensor3d([1, 1, 1, 2, 3, 4], [2, 3, 1])).dataSync()));
    expect(product).toEqual([6, 15, 2, 3]); // [1+2+3, 4+5+6] and [2, 3]
  });
});
