import { describe, expect, it } from 'vitest';
import { summarise } from '../../src/stats/summarise.js';

describe('summarise', () => {
  it('gives mean, sd and the t-based 95% CI of a hand example', () => {
    // Values 1, 2, 3, 4, 5: mean 3, sample sd √2.5 = 1.58114 (by hand);
    // half-width t(0.975, 4) · sd / √5 = 2.7764 · 0.70711 = 1.96324 (t from standard tables).
    const s = summarise([1, 2, 3, 4, 5]);
    expect(s.n).toBe(5);
    expect(s.mean).toBe(3);
    expect(s.sd).toBeCloseTo(1.58114, 5);
    expect(s.ciLow).toBeCloseTo(3 - 1.96324, 4);
    expect(s.ciHigh).toBeCloseTo(3 + 1.96324, 4);
  });

  it('drops non-finite values and counts only the rest', () => {
    const s = summarise([1, NaN, 3, Infinity]);
    expect(s.n).toBe(2);
    expect(s.mean).toBe(2);
  });

  it('gives the value but NaN spread for a single value, and all NaN for none', () => {
    const one = summarise([0.7]);
    expect([one.n, one.mean]).toEqual([1, 0.7]);
    expect(one.sd).toBeNaN();
    expect(one.ciLow).toBeNaN();
    const none = summarise([]);
    expect(none.n).toBe(0);
    expect(none.mean).toBeNaN();
  });

  it('gives a zero-width CI for identical values', () => {
    const s = summarise([0.5, 0.5, 0.5]);
    expect([s.sd, s.ciLow, s.ciHigh]).toEqual([0, 0.5, 0.5]);
  });
});
