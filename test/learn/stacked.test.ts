import * as tf from '@tensorflow/tfjs-core';
import { describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { stackedEpochSeconds } from '../../src/learn/stacked.js';

describe('stackedEpochSeconds', () => {
  it('times each epoch of a tiny stacked workload and frees every tensor', async () => {
    await initBackend('wasm');
    const before = tf.memory().numTensors;
    const seconds = stackedEpochSeconds({ models: 2, widths: [3, 4, 2], batch: 4, rows: 8, epochs: 3 }, 0);
    expect(seconds).toHaveLength(3);
    seconds.forEach((s) => expect(s).toBeGreaterThan(0));
    expect(tf.memory().numTensors).toBe(before);
  });
});
