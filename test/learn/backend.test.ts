import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend, softwareVersions } from '../../src/learn/index.js';

describe('initBackend', () => {
  it('starts wasm by default, switches to cpu and back, and may be called repeatedly', async () => {
    await initBackend();
    expect(tf.getBackend()).toBe('wasm');
    await initBackend('wasm');
    await initBackend('cpu');
    expect(softwareVersions()).toEqual({ 'tfjs-core': '4.22.0', 'tfjs-backend': 'cpu' });
    await initBackend('wasm');
    expect(tf.getBackend()).toBe('wasm');
  });

  it('registers gradients, so autodiff works: d/dx Σ x² = 2x', async () => {
    await initBackend('wasm');
    const g = tf.tidy(() => Array.from(tf.grad((x: tf.Tensor) => tf.sum(tf.square(x)))(tf.tensor1d([1, -2, 3])).dataSync()));
    expect(g).toEqual([2, -4, 6]);
  });

  it('keeps the matrix-product gradient right on wasm for every transpose combination', async () => {
    // d/dA Σ (op(A)·op(B)) and d/dB, compared with the cpu backend's stock gradient.
    const a = [[1, 2, 3], [4, 5, 6]];
    const b = [[1, -1], [0, 2], [3, 1]];
    const grads = (tA: boolean, tB: boolean) => tf.tidy(() => {
      const A = tA ? tf.transpose(tf.tensor2d(a)) : tf.tensor2d(a);
      const B = tB ? tf.transpose(tf.tensor2d(b)) : tf.tensor2d(b);
      return tf.grads((x: tf.Tensor, y: tf.Tensor) => tf.sum(tf.matMul(x, y, tA, tB)))([A, B]).flatMap((g) => Array.from(g.dataSync()));
    });
    for (const [tA, tB] of [[false, false], [false, true], [true, false], [true, true]] as const) {
      await initBackend('cpu');
      const expected = grads(tA, tB);
      await initBackend('wasm');
      expect(grads(tA, tB)).toEqual(expected);
    }
  });
});
