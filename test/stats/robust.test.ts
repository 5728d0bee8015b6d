import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../../src/random.js';
import { bootstrapCi, interquartileMean, quantile } from '../../src/stats/robust.js';
import { mean } from '../../src/stats/summarise.js';

describe('interquartileMean', () => {
  it('averages the middle half of a hand example (8 values: drop 2 from each end)', () => {
    // Sorted 1 2 3 4 5 6 7 100 → middle 3 4 5 6 → 4.5 (by hand; the outlier has no pull).
    expect(interquartileMean([7, 1, 100, 3, 2, 6, 5, 4])).toBe(4.5);
  });

  it('drops floor(n / 4) from each end when n is not a multiple of 4', () => {
    // 5 values: drop 1 each end → mean(2, 3, 4) = 3 (by hand).
    expect(interquartileMean([1, 2, 3, 4, 100])).toBe(3);
  });

  it('is NaN for no values', () => {
    expect(interquartileMean([])).toBeNaN();
  });
});

describe('quantile', () => {
  it('interpolates linearly between order statistics (Hyndman & Fan 1996, type 7)', () => {
    // (n − 1)·q = 3·0.5 = 1.5 → halfway between 2 and 3 (by hand).
    expect(quantile([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantile([1, 2, 3, 4], 1)).toBe(4);
  });
});

describe('bootstrapCi', () => {
  it('covers the true mean in about 93.6% of samples, neither fewer nor more (fixed seed, 1000 samples of 30)', () => {
    // The percentile interval of a mean is about x̄ ± z₀.₉₇₅ · s·√((n − 1)/n) / √n (plug-in sd,
    // normal quantiles; Efron & Tibshirani 1993, ch. 13), so for normal data of n = 30 it covers
    // with probability P(|t₂₉| < 1.96·√(29/30)) = 0.936 (Student's t, by hand), below the
    // nominal 0.95. With 1000 trials the binomial SE is 0.0077: [0.936 − 4.5 SE, 0.936 + 4 SE]
    // ≈ [0.90, 0.97], the lower side allowing for the noise of 400 resamples. An interval too
    // wide, or infinite, covers nearly always and fails the upper bound.
    const rng = createRng(11, 'bootstrap-test');
    let covered = 0;
    const trials = 1000;
    for (let t = 0; t < trials; t++) {
      const sample = Array.from({ length: 30 }, () => 2 + normal(rng));
      const ci = bootstrapCi(sample, mean, rng, 400);
      if (ci.low <= 2 && 2 <= ci.high) covered++;
    }
    expect(covered / trials).toBeGreaterThan(0.90);
    expect(covered / trials).toBeLessThan(0.97);
  });

  it('brackets the sample mean and reproduces itself from the same seed', () => {
    const data = [3.1, 2.4, 5.0, 4.2, 3.3, 2.8, 3.9];
    const a = bootstrapCi(data, mean, createRng(5, 'bootstrap'), 500);
    const b = bootstrapCi(data, mean, createRng(5, 'bootstrap'), 500);
    expect(a).toEqual(b);
    expect(a.estimate).toBeCloseTo(mean(data), 12);
    expect(a.low).toBeLessThan(a.estimate);
    expect(a.high).toBeGreaterThan(a.estimate);
  });

  it('gives NaN bounds for fewer than 2 values and rejects a bad resample count', () => {
    const r = bootstrapCi([1], mean, createRng(1, 'bootstrap'));
    expect(r.estimate).toBe(1);
    expect(r.low).toBeNaN();
    expect(() => bootstrapCi([1, 2], mean, createRng(1, 'bootstrap'), 0)).toThrow('resamples must be a positive integer, got 0');
  });
});
