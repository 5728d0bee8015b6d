import * as tf from '@tensorflow/tfjs-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { initBackend } from '../../src/learn/backend.js';
import { infoNce, softmaxCrossEntropy } from '../../src/learn/losses.js';
import { createRng, normal } from '../../src/random.js';

beforeAll(() => initBackend('wasm'));

const value = (f: () => tf.Scalar): number => tf.tidy(() => f().dataSync()[0]);

describe('InfoNCE (van den Oord et al. 2018, eq. 4; bound I ≥ log N − L)', () => {
  it('is near 0 for aligned, well-separated embeddings', () => {
    // One-hot rows are orthogonal: cos = 1 for the positive, 0 for every negative; with
    // τ = 0.05 the loss is log(1 + (N − 1)·e^(−20)) ≈ 1.3e-7 (hand-derived).
    const loss = value(() => {
      const z = tf.eye(16);
      return infoNce(z, z, 0.05);
    });
    expect(loss).toBeCloseTo(Math.log(1 + 15 * Math.exp(-20)), 5);
    expect(loss).toBeLessThan(1e-4);
  });

  it('is near log(batch) for independent random embeddings', () => {
    // In 512 dimensions random cosines are ~N(0, 1/512), so with τ = 1 every logit is
    // within a few hundredths of 0 and the loss is log N up to ~1% (tolerance: 0.05 nats).
    const rng = createRng(7, 'test');
    const n = 32;
    const d = 512;
    const loss = value(() => infoNce(
      tf.tensor2d(Float32Array.from({ length: n * d }, () => normal(rng)), [n, d]),
      tf.tensor2d(Float32Array.from({ length: n * d }, () => normal(rng)), [n, d]),
      1,
    ));
    expect(Math.abs(loss - Math.log(n))).toBeLessThan(0.05);
  });

  it('is symmetric in its two views', () => {
    const rng = createRng(8, 'test');
    const a = Float32Array.from({ length: 40 }, () => normal(rng));
    const b = Float32Array.from({ length: 40 }, () => normal(rng));
    const ab = value(() => infoNce(tf.tensor2d(a, [8, 5]), tf.tensor2d(b, [8, 5]), 0.3));
    const ba = value(() => infoNce(tf.tensor2d(b, [8, 5]), tf.tensor2d(a, [8, 5]), 0.3));
    expect(ab).toBeCloseTo(ba, 5);
  });
});

describe('softmax cross-entropy', () => {
  it('matches −log softmax by hand', () => {
    // logits [0, ln 3] give softmax [1/4, 3/4]; labels 1 and 0 give (−log 3/4 − log 1/4) / 2.
    const loss = value(() => softmaxCrossEntropy(tf.tensor2d([[0, Math.log(3)], [0, Math.log(3)]]), tf.tensor1d([1, 0])));
    expect(loss).toBeCloseTo((-Math.log(0.75) - Math.log(0.25)) / 2, 5);
  });
});
