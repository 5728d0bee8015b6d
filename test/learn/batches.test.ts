import * as tf from '@tensorflow/tfjs-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { BatchLosses } from '../../src/learn/batch-losses.js';
import { batchOf, ExampleTensors, takeRows } from '../../src/learn/batches.js';
import type { Matrix } from '../../src/learn/matrix.js';

beforeAll(() => initBackend('wasm'));

// A 4 × 3 matrix whose entry (r, c) is 10·r + c, so every copied value names its source.
const m: Matrix = { rows: 4, cols: 3, data: Float32Array.from({ length: 12 }, (_, i) => 10 * Math.floor(i / 3) + (i % 3)) };

describe('batchOf', () => {
  it('copies the requested rows in the requested order', () => {
    expect(Array.from(takeRows(m, [3, 0, 3]))).toEqual([30, 31, 32, 0, 1, 2, 30, 31, 32]);
  });

  it('copies rows four at a time and the rest one by one alike: 6 rows of 4 taken in reverse', () => {
    expect(Array.from(takeRows(m, [3, 2, 1, 0, 3, 2]))).toEqual([30, 31, 32, 20, 21, 22, 10, 11, 12, 0, 1, 2, 30, 31, 32, 20, 21, 22]);
  });

  it.each(['wasm', 'cpu'] as const)('gathers the rows on %s from one upload of a matrix used as both input and target (an autoencoder\'s batch)', async (backend) => {
    await initBackend(backend);
    const before = tf.memory().numTensors;
    const split = new ExampleTensors({ n: 4, inputs: [m], extra: null, target: m });
    const batch = batchOf(split, Int32Array.from([2, 1, 3, 2, 0]));
    expect(batch.target).toBe(batch.inputs[0]);
    expect(batch.inputs[0].shape).toEqual([5, 3]);
    expect(Array.from(batch.inputs[0].dataSync())).toEqual([20, 21, 22, 10, 11, 12, 30, 31, 32, 20, 21, 22, 0, 1, 2]);
    expect(tf.memory().numTensors).toBe(before + 2); // the uploaded matrix and the batch
    const again = batchOf(split, Int32Array.from([3]));
    expect(Array.from(again.inputs[0].dataSync())).toEqual([30, 31, 32]);
    expect(tf.memory().numTensors).toBe(before + 3); // the matrix is not uploaded twice
    tf.dispose([batch.inputs[0], again.inputs[0]]);
    split.dispose();
    expect(tf.memory().numTensors).toBe(before);
    await initBackend('wasm');
  });

  it('leaves the inputs out when asked (a spiking tower codes its own)', () => {
    const split = new ExampleTensors({ n: 4, inputs: [m], extra: null, target: m });
    const batch = batchOf(split, Int32Array.from([1]), false);
    expect(batch.inputs).toEqual([]);
    expect(Array.from(batch.target!.dataSync())).toEqual([10, 11, 12]);
    tf.dispose(batch.target!);
    split.dispose();
  });
});

describe('BatchLosses', () => {
  it('weights each batch by its rows: (1·256 + 4·64) / 320 = 1.6 (worked by hand)', () => {
    const losses = new BatchLosses();
    losses.add(tf.scalar(1), 256);
    losses.add(tf.scalar(4), 64);
    expect(losses.count).toBe(320);
    expect(losses.read()).toEqual({ mean: 1.6, firstNonFinite: null });
  });

  it('reports the first non-finite batch loss and frees every tensor', () => {
    const before = tf.memory().numTensors;
    const losses = new BatchLosses();
    [2, Infinity, NaN].forEach((v) => losses.add(tf.scalar(v), 10));
    expect(losses.read().firstNonFinite).toBe(Infinity);
    expect(tf.memory().numTensors).toBe(before);
  });
});
