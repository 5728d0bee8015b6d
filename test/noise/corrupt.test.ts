import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../../src/random.js';
import { channelReference } from '../../src/noise/reference.js';
import { corruptChannel, noiseRng } from '../../src/noise/corrupt.js';
import type { ChannelName } from '../../src/senses/channel.js';

/** Rows whose entry j has mean 10·j and std j + 1, drawn from a fixed seed. */
function spreadRows(n: number, size: number, seed: number): Float32Array {
  const rng = createRng(seed, 'test-rows');
  const out = new Float32Array(n * size);
  for (let i = 0; i < n; i++) for (let j = 0; j < size; j++) out[i * size + j] = 10 * j + (j + 1) * normal(rng);
  return out;
}

/** Band levels in dB for [n, 2, bands], between 30 and 70 dB. */
function soundRows(n: number, bands: number, seed: number): Float32Array {
  const rng = createRng(seed, 'test-sound');
  return Float32Array.from({ length: n * 2 * bands }, () => 30 + 40 * rng());
}

function referenceOf(values: Float32Array, size: number, channel: ChannelName) {
  const n = values.length / size;
  return channelReference(values, size, Array.from({ length: n }, (_, i) => i), channel);
}

describe('gaussian', () => {
  it('adds noise whose std is σ training stds of each entry (N = 20000 per entry, 5 standard errors)', () => {
    const n = 20000;
    const size = 3;
    const values = spreadRows(n, size, 1);
    const reference = referenceOf(values, size, 'touch');
    const out = corruptChannel(values, size, 'gaussian', 2, reference, createRng(1, 'g'));
    for (let j = 0; j < size; j++) {
      let sum = 0;
      let sumSq = 0;
      for (let i = 0; i < n; i++) {
        const z = (out[i * size + j] - values[i * size + j]) / reference.std[j];
        sum += z;
        sumSq += z * z;
      }
      const mean = sum / n;
      const sd = Math.sqrt(sumSq / n - mean * mean);
      // Sampling error of a normal's sample std is about σ / sqrt(2N) (standard result).
      expect(Math.abs(sd - 2)).toBeLessThan(5 * 2 / Math.sqrt(2 * n));
      expect(Math.abs(mean)).toBeLessThan(5 * 2 / Math.sqrt(n));
    }
  });

  it('leaves the input array untouched and σ = 0 returns an equal copy', () => {
    const values = spreadRows(10, 3, 2);
    const before = Float32Array.from(values);
    const reference = referenceOf(values, 3, 'sight');
    const out = corruptChannel(values, 3, 'gaussian', 0, reference, createRng(2, 'g'));
    expect(out).not.toBe(values);
    expect(Array.from(out)).toEqual(Array.from(before));
    corruptChannel(values, 3, 'gaussian', 4, reference, createRng(2, 'g'));
    expect(Array.from(values)).toEqual(Array.from(before));
  });
});

describe('dropout', () => {
  it('silences a fraction p of entries (binomial, N = 60000, 5 standard errors)', () => {
    const n = 20000;
    const values = spreadRows(n, 3, 3).map((v) => v + 1000); // never equal to the silence level 0
    const reference = referenceOf(values, 3, 'sight');
    const p = 0.3;
    const out = corruptChannel(values, 3, 'dropout', p, reference, createRng(3, 'd'));
    const silenced = out.filter((v) => v === 0).length / out.length;
    expect(Math.abs(silenced - p)).toBeLessThan(5 * Math.sqrt(p * (1 - p) / out.length));
  });

  it('sets a silenced sound band to the ambient floor, the quietest training level, not to 0 dB', () => {
    const values = soundRows(500, 4, 4);
    const reference = referenceOf(values, 8, 'sound');
    const quietest = values.reduce((a, b) => Math.min(a, b), Infinity);
    const out = corruptChannel(values, 8, 'dropout', 1, reference, createRng(4, 'd'));
    expect(out.every((v) => v === quietest)).toBe(true);
  });
});

describe('blackout', () => {
  it('silences whole rows with probability p (binomial, N = 20000 rows, 5 standard errors)', () => {
    const n = 20000;
    const values = spreadRows(n, 4, 5).map((v) => v + 1000);
    const reference = referenceOf(values, 4, 'touch');
    const p = 0.7;
    const out = corruptChannel(values, 4, 'blackout', p, reference, createRng(5, 'b'));
    let black = 0;
    for (let i = 0; i < n; i++) {
      const row = Array.from(out.subarray(i * 4, i * 4 + 4));
      const original = Array.from(values.subarray(i * 4, i * 4 + 4));
      const isBlack = row.every((v) => v === 0);
      expect(isBlack || row.every((v, j) => v === original[j])).toBe(true);
      if (isBlack) black++;
    }
    expect(Math.abs(black / n - p)).toBeLessThan(5 * Math.sqrt(p * (1 - p) / n));
  });
});

describe('masking', () => {
  // SNR = 10·log10(Ps/Pn), powers from levels by P = 10^(L/10) (the decibel definition,
  // e.g. Kinsler et al., Fundamentals of Acoustics, 4th ed., ch. 5, from memory).
  for (const snrDb of [20, 5, 0, -5]) {
    it(`adds noise at ${snrDb} dB SNR in the power domain (N = 2000 rows × 2 ears × 16 bands, within 0.1 dB)`, () => {
      const bands = 16;
      const values = soundRows(2000, bands, 6);
      const reference = referenceOf(values, 2 * bands, 'sound');
      const out = corruptChannel(values, 2 * bands, 'masking', snrDb, reference, createRng(6, 'm'));
      let signal = 0;
      let added = 0;
      for (let i = 0; i < values.length; i++) {
        const before = 10 ** (values[i] / 10);
        signal += before;
        added += 10 ** (out[i] / 10) - before;
      }
      // About 64000 exponential draws: the relative error of their mean is ~0.4%, i.e. ~0.02 dB.
      expect(Math.abs(10 * Math.log10(signal / added) - snrDb)).toBeLessThan(0.1);
    });
  }

  it('only raises band levels, since powers add', () => {
    const values = soundRows(200, 8, 7);
    const out = corruptChannel(values, 16, 'masking', 0, referenceOf(values, 16, 'sound'), createRng(7, 'm'));
    for (let i = 0; i < values.length; i++) expect(out[i]).toBeGreaterThanOrEqual(values[i]);
  });

  it('scales the noise to each ear: a loud left ear gets louder noise than a quiet right ear', () => {
    const bands = 4;
    const values = new Float32Array(2 * bands * 1000);
    for (let i = 0; i < 1000; i++) {
      values.fill(70, i * 2 * bands, i * 2 * bands + bands);
      values.fill(30, i * 2 * bands + bands, (i + 1) * 2 * bands);
    }
    const out = corruptChannel(values, 2 * bands, 'masking', 0, referenceOf(values, 2 * bands, 'sound'), createRng(8, 'm'));
    let left = 0;
    let right = 0;
    for (let i = 0; i < 1000; i++) {
      for (let b = 0; b < bands; b++) {
        left += 10 ** (out[i * 2 * bands + b] / 10) - 1e7;
        right += 10 ** (out[i * 2 * bands + bands + b] / 10) - 1e3;
      }
    }
    // At 0 dB SNR each ear's added power equals its own signal power: 1e7 vs 1e3 per band.
    expect(10 * Math.log10(left / (1000 * bands * 1e7))).toBeCloseTo(0, 0);
    expect(10 * Math.log10(right / (1000 * bands * 1e3))).toBeCloseTo(0, 0);
  });
});

describe('common random numbers', () => {
  it('gives two learners of one seed identical corrupted inputs, and another seed different ones', () => {
    const values = spreadRows(100, 5, 9);
    const reference = referenceOf(values, 5, 'sight');
    const first = corruptChannel(values, 5, 'gaussian', 1, reference, noiseRng(4, 'sight', 'gaussian', 3));
    const second = corruptChannel(values, 5, 'gaussian', 1, reference, noiseRng(4, 'sight', 'gaussian', 3));
    const otherSeed = corruptChannel(values, 5, 'gaussian', 1, reference, noiseRng(5, 'sight', 'gaussian', 3));
    expect(Array.from(second)).toEqual(Array.from(first));
    expect(Array.from(otherSeed)).not.toEqual(Array.from(first));
  });
});

describe('corruptChannel input checks', () => {
  const values = spreadRows(4, 4, 10);
  const sight = referenceOf(values, 4, 'sight');
  const rng = createRng(0, 'x');

  it('rejects values that are not whole rows', () => {
    expect(() => corruptChannel(values.subarray(0, 7), 4, 'gaussian', 1, sight, rng)).toThrow('sight values of length 7 are not rows of size 4');
  });

  it('rejects a reference of another size', () => {
    expect(() => corruptChannel(values, 2, 'gaussian', 1, sight, rng)).toThrow('reference for sight has size 4, values have 2');
  });
});
