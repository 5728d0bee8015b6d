import { describe, expect, it } from 'vitest';
import { pairedComparison } from '../../src/stats/paired.js';

// Student's (1908) sleep data: extra hours of sleep of 10 patients under two drugs
// (Cushny & Peebles 1905, as tabled in Student 1908; R's `sleep` dataset), from memory.
const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

describe('pairedComparison', () => {
  it("reproduces the paired t-test on Student's sleep data", () => {
    // By hand: differences -1.2 -2.4 -1.3 -1.3 0 -1.0 -1.8 -0.8 -4.6 -1.4, sum -15.8,
    // mean -1.58; Σ(d - mean)² = 13.616, sd = √(13.616 / 9) = 1.229995,
    // se = sd / √10 = 0.388958, t = -4.0621 (df 9). The p-value 0.002833 and CI
    // (-2.4599, -0.7001) are R's t.test(..., paired = TRUE) output (from memory),
    // confirmed with SciPy 1.17 stats.ttest_rel: t = -4.062128, p = 0.0028329.
    const r = pairedComparison(drug1, drug2);
    expect(r.n).toBe(10);
    expect(r.meanDiff).toBeCloseTo(-1.58, 10);
    expect(r.sdDiff).toBeCloseTo(1.229995, 5);
    expect(r.t).toBeCloseTo(-4.0621, 4);
    expect(r.p).toBeCloseTo(0.002833, 6);
    expect(r.ciLow).toBeCloseTo(-2.4599, 4);
    expect(r.ciHigh).toBeCloseTo(-0.7001, 4);
    expect(r.dz).toBeCloseTo(-1.58 / 1.229995, 5);
    expect(r.note).toBe('');
  });

  it('is antisymmetric: swapping a and b flips the sign of the difference, keeps p', () => {
    const ab = pairedComparison(drug1, drug2);
    const ba = pairedComparison(drug2, drug1);
    expect(ba.meanDiff).toBeCloseTo(-ab.meanDiff, 12);
    expect(ba.p).toBeCloseTo(ab.p, 12);
  });

  it('drops pairs with a non-finite member', () => {
    const r = pairedComparison([1, NaN, 3, 5], [0, 1, 1, 2]);
    expect(r.n).toBe(3);
    expect(r.meanDiff).toBe(2);
  });

  it('reports NaN test figures for fewer than 2 pairs, never Infinity', () => {
    const r = pairedComparison([0.9], [0.5]);
    expect(r.n).toBe(1);
    expect(r.meanDiff).toBeCloseTo(0.4, 12);
    for (const v of [r.sdDiff, r.ciLow, r.ciHigh, r.t, r.p, r.dz]) expect(v).toBeNaN();
    expect(r.note).toBe('fewer than 2 pairs');
  });

  it('reports NaN t, p and d_z when all differences are equal, with a collapsed CI', () => {
    const same = pairedComparison([0.5, 0.6, 0.7], [0.5, 0.6, 0.7]);
    expect([same.meanDiff, same.sdDiff, same.ciLow, same.ciHigh]).toEqual([0, 0, 0, 0]);
    expect(same.p).toBeNaN();
    expect(same.note).toBe('differences have zero variance');
    // 0.6 − 0.5 and 0.8 − 0.7 differ in the last bits of a double; that is not variation.
    const shifted = pairedComparison([0.6, 0.7, 0.8], [0.5, 0.6, 0.7]);
    expect(shifted.note).toBe('differences have zero variance');
    expect(shifted.t).toBeNaN();
    expect(shifted.p).toBeNaN();
    expect(shifted.ciLow).toBe(shifted.meanDiff);
  });

  it('rejects inputs of different lengths', () => {
    expect(() => pairedComparison([1, 2], [1])).toThrow('pairedComparison: a has 2 values but b has 1');
  });
});
