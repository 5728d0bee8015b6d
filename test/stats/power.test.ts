import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../../src/random.js';
import { noncentralTSurvival } from '../../src/stats/noncentral-t.js';
import { pairedComparison } from '../../src/stats/paired.js';
import { minimumDetectableDz, pairedTPower, seedsNeeded } from '../../src/stats/power.js';
import { tCritical } from '../../src/stats/student-t.js';

const phi = (x: number) => jStat.normal.cdf(x, 0, 1);

/**
 * P(T > t), t > 0, for the noncentral t with 2 degrees of freedom in closed form, derived by
 * hand: with ν = 2, S² = V/2 is exponential with mean 1, so P(T > t) = E[(1 − e^{−(Z+δ)²/t²})
 * · 1{Z > −δ}]; completing the square in the Gaussian integral, with a = 1/2 + 1/t²,
 *   P(T > t) = Φ(δ) − (2a)^{−1/2} · exp(−δ²/t² + δ²/(a t⁴)) · Φ(√(2a) · (δ − δ/(a t²))).
 */
function survivalDf2(t: number, delta: number): number {
  const a = 0.5 + 1 / t ** 2;
  const shift = delta / (a * t ** 2);
  return phi(delta) - Math.exp(-(delta ** 2) / t ** 2 + (delta * shift) / t ** 2) * phi(Math.sqrt(2 * a) * (delta - shift)) / Math.sqrt(2 * a);
}

/** t_crit of a two-sided test at level alpha with df degrees of freedom. */
const critical = (df: number, alpha: number) => tCritical(df, 1 - alpha);

describe('noncentralTSurvival', () => {
  // The case jStat 1.9.6's noncentralt.cdf gets wrong: df 2, δ 30, at the critical value of
  // a two-sided test at 0.05 / 120 (t = 48.974). jStat gives 1 − 1.7e-40; a simulation 0.31.
  const t120 = critical(2, 0.05 / 120);

  it('matches the closed form for 2 degrees of freedom at df 2, δ 30 (0.312943), both tails, to 1e-9', () => {
    expect(survivalDf2(t120, 30)).toBeCloseTo(0.3129434175, 9);
    expect(noncentralTSurvival(t120, 2, 30)).toBeCloseTo(survivalDf2(t120, 30), 9);
    // The lower tail P(T < −t) = P(−T > t), −T with noncentrality −30: below 1e-200.
    expect(noncentralTSurvival(t120, 2, -30)).toBeCloseTo(survivalDf2(t120, -30), 12);
  });

  it.each([[4.3027, 3], [4.3027, -3], [1, 0.5], [10, 12], [0.2, -1]])('matches the df 2 closed form at t = %f, δ = %f, to 1e-9', (t, delta) => {
    expect(noncentralTSurvival(t, 2, delta)).toBeCloseTo(survivalDf2(t, delta), 9);
  });

  it('reduces to the central t when δ = 0: the closed forms for 1 and 2 df, to 1e-10', () => {
    // Student's t with 1 df is the Cauchy distribution, F(t) = 1/2 + atan(t)/π; with 2 df,
    // F(t) = 1/2 + t / (2√(2 + t²)) (both by integrating the density by hand).
    for (const t of [-3, -0.5, 0, 0.7, 2.5, 12]) {
      expect(noncentralTSurvival(t, 1, 0)).toBeCloseTo(0.5 - Math.atan(t) / Math.PI, 10);
      expect(noncentralTSurvival(t, 2, 0)).toBeCloseTo(0.5 - t / (2 * Math.sqrt(2 + t * t)), 10);
    }
  });

  it('reduces to the central t when δ = 0 at 30 df (jStat.studentt, a maintained library), to 5e-9', () => {
    // jStat's central t is itself good to a few 1e-9 (it gives 0.4999999972 at t = 0, df 5).
    for (const t of [-3, -0.5, 0, 0.7, 2.5, 12]) expect(noncentralTSurvival(t, 30, 0)).toBeCloseTo(1 - jStat.studentt.cdf(t, 30), 8);
  });

  it.each([
    // [t, df, δ, P(T > t)]: scipy.stats.nct.sf from SciPy 1.17.1 (Boost's non_central_t), a maintained reference library.
    [2, 5, 1.5, 0.36855075274432825],
    [2, 5, -1.5, 0.0015165854524393971],
    [10, 1, 5, 0.38117661100994255],
    [3, 30, -2, 1.5572381133305503e-6],
    [2, 200, 3, 0.8407462062231102],
    [0.5, 1, -3, 0.0005050858938373189],
  ])('gives SciPy\'s value at t = %f, df = %i, δ = %f, to 1e-9', (t, df, delta, expected) => {
    expect(noncentralTSurvival(t, df, delta)).toBeCloseTo(expected, 9);
  });

  it('gives R\'s power.t.test(n = 20, delta = 1) one-tailed power 0.8689528 (from memory; SciPy 1.17.1 agrees)', () => {
    // Two samples of 20, sd 1: df 38, δ = 1·√(20/2); R's default counts the upper tail only.
    expect(noncentralTSurvival(critical(38, 0.05), 38, Math.sqrt(10))).toBeCloseTo(0.8689528, 7);
  });

  it('rejects non-positive degrees of freedom and non-finite arguments', () => {
    expect(() => noncentralTSurvival(1, 0, 1)).toThrow('noncentralTSurvival: df must be positive, got 0');
    expect(() => noncentralTSurvival(NaN, 3, 1)).toThrow('noncentralTSurvival: t and delta must be finite, got NaN and 1');
  });
});

/**
 * Share of `trials` simulated paired t-tests on n seeds (a − b, a ~ N(√2·d_z, 1), b ~ N(0, 1),
 * so the differences have standardised mean d_z) whose p falls below `level`, counted by the
 * sign of t.
 */
function simulatedRejections(n: number, dz: number, level: number, trials: number, seed: number): { upper: number; lower: number } {
  const rng = createRng(seed, 'power-test');
  let upper = 0;
  let lower = 0;
  for (let trial = 0; trial < trials; trial++) {
    const a = Array.from({ length: n }, () => Math.SQRT2 * dz + normal(rng));
    const b = Array.from({ length: n }, () => normal(rng));
    const { p, t } = pairedComparison(a, b);
    if (p < level && t > 0) upper++;
    if (p < level && t < 0) lower++;
  }
  return { upper: upper / trials, lower: lower / trials };
}

/** Four binomial standard errors of a share estimated from `trials` draws (false alarm ≈ 6e-5). */
const fourSe = (p: number, trials: number) => 4 * Math.sqrt((p * (1 - p)) / trials);

describe('pairedTPower against a seeded simulation of the paired t-test (20 000 trials, ε = 4 binomial SE)', () => {
  const trials = 20_000;

  it('gives 0.3129 with 3 seeds at df 2, δ = 30 (d_z = 30/√3), in a family of 120', () => {
    const dz = 30 / Math.sqrt(3);
    const power = pairedTPower({ n: 3, dz, familySize: 120 });
    expect(power).toBeCloseTo(0.3129434175, 9); // the df 2 closed form above
    const simulated = simulatedRejections(3, dz, 0.05 / 120, trials, 1);
    expect(Math.abs(simulated.upper + simulated.lower - power)).toBeLessThan(fourSe(power, trials));
  });

  it('gives 0.8031 with 10 seeds at d_z = 1 (one hypothesis)', () => {
    const power = pairedTPower({ n: 10, dz: 1 });
    expect(power).toBeCloseTo(0.8030968566, 8); // SciPy 1.17.1 nct, both tails
    const simulated = simulatedRejections(10, 1, 0.05, trials, 2);
    expect(Math.abs(simulated.upper + simulated.lower - power)).toBeLessThan(fourSe(power, trials));
  });

  it('counts the lower tail: 3 seeds at d_z = 0.2 reject on the wrong side about 1.5 % of the time', () => {
    const t = critical(2, 0.05);
    const lower = noncentralTSurvival(t, 2, -0.2 * Math.sqrt(3));
    const upper = noncentralTSurvival(t, 2, 0.2 * Math.sqrt(3));
    expect(pairedTPower({ n: 3, dz: 0.2 })).toBeCloseTo(upper + lower, 12);
    const simulated = simulatedRejections(3, 0.2, 0.05, trials, 3);
    expect(Math.abs(simulated.lower - lower)).toBeLessThan(fourSe(lower, trials));
    expect(Math.abs(simulated.upper - upper)).toBeLessThan(fourSe(upper, trials));
  });

  it.each([[3, 1], [10, 1], [3, 6], [10, 6]])('equals the test level at d_z = 0 (central t), n = %i, family of %i', (n, familySize) => {
    expect(pairedTPower({ n, dz: 0, familySize })).toBeCloseTo(0.05 / familySize, 9);
  });

  it('is symmetric in the sign of d_z', () => {
    expect(pairedTPower({ n: 4, dz: -1.3 })).toBeCloseTo(pairedTPower({ n: 4, dz: 1.3 }), 12);
  });
});

describe('minimumDetectableDz (two-sided paired t, power 0.8, α = 0.05 / family size)', () => {
  it.each([
    // Reference: the root of SciPy 1.17.1's nct power (both tails) found with scipy.optimize.brentq.
    [3, 1, 3.2640435497], [5, 1, 1.6819969660], [10, 1, 0.9960013715],
    [3, 6, 8.0193982293], [5, 6, 2.7592626370], [10, 6, 1.3714409758],
  ])('with %i seeds in a family of %i is %f (to 1e-6)', (n, familySize, expected) => {
    const { dz, note } = minimumDetectableDz({ n, familySize });
    expect(note).toBe('');
    expect(Math.abs(dz - expected)).toBeLessThan(1e-6);
  });

  it('is detected with the target power, verified by a seeded simulation (5 seeds, family of 6, 20 000 trials)', () => {
    const { dz } = minimumDetectableDz({ n: 5, familySize: 6 });
    const simulated = simulatedRejections(5, dz, 0.05 / 6, 20_000, 4);
    expect(Math.abs(simulated.upper + simulated.lower - 0.8)).toBeLessThan(fourSe(0.8, 20_000));
  });

  it('is NaN with fewer than 2 seeds, saying why', () => {
    expect(minimumDetectableDz({ n: 1 })).toEqual({ dz: NaN, note: 'fewer than 2 seeds' });
    expect(minimumDetectableDz({ n: 0 })).toEqual({ dz: NaN, note: 'fewer than 2 seeds' });
  });

  it('rejects a level or power out of range and a bad family size', () => {
    expect(() => minimumDetectableDz({ n: 5, alpha: 0 })).toThrow('alpha must be in (0, 1), got 0');
    expect(() => minimumDetectableDz({ n: 5, alpha: 1.2 })).toThrow('alpha must be in (0, 1), got 1.2');
    expect(() => minimumDetectableDz({ n: 5, power: 1 })).toThrow('power must be in (0.05, 1) (above the test\'s level), got 1');
    expect(() => minimumDetectableDz({ n: 5, familySize: 0 })).toThrow('familySize must be a positive integer, got 0');
    expect(() => minimumDetectableDz({ n: 2.5 })).toThrow('minimumDetectableDz: n must be a non-negative integer, got 2.5');
  });
});

describe('seedsNeeded (two-sided paired t, power 0.8)', () => {
  it('needs 64 and 26 per group for d = 0.5 and 0.8 with two independent samples (Cohen 1992, Table 2)', () => {
    // Not a paired test, but the same noncentral t: df 2n − 2, δ = d·√(n/2). Cohen's table
    // lists n per group for power 0.80 at two-sided α = 0.05; n − 1 must fall short.
    const twoSamplePower = (n: number, d: number) => {
      const t = critical(2 * n - 2, 0.05);
      return noncentralTSurvival(t, 2 * n - 2, d * Math.sqrt(n / 2)) + noncentralTSurvival(t, 2 * n - 2, -d * Math.sqrt(n / 2));
    };
    for (const [d, n] of [[0.5, 64], [0.8, 26]]) {
      expect(twoSamplePower(n, d)).toBeGreaterThanOrEqual(0.8);
      expect(twoSamplePower(n - 1, d)).toBeLessThan(0.8);
    }
  });

  it('needs 10 seeds for d_z = 1 and 34 for d_z = 0.5 alone (R\'s power.t.test, type "paired": 9.94 and 33.37, from memory)', () => {
    expect(seedsNeeded({ dz: 1 })).toEqual({ seeds: 10, power: expect.closeTo(0.8030969, 6), note: '' });
    expect(seedsNeeded({ dz: 0.5 }).seeds).toBe(34);
  });

  it('needs 16 seeds for d_z = 1 in a family of 6 (15 give 0.772; SciPy 1.17.1 nct)', () => {
    expect(seedsNeeded({ dz: 1, familySize: 6 })).toEqual({ seeds: 16, power: expect.closeTo(0.8130640, 6), note: '' });
    expect(pairedTPower({ n: 15, dz: 1, familySize: 6 })).toBeCloseTo(0.7722051, 6);
  });

  it('says so when more seeds than the cap would be needed, instead of searching on', () => {
    // Power at the cap, 0.0615103, from SciPy 1.17.1 nct; d_z = 0 stays at the test level.
    expect(seedsNeeded({ dz: 0.01 })).toEqual({ seeds: null, power: expect.closeTo(0.0615103, 6), note: 'more than 1000 seeds' });
    expect(seedsNeeded({ dz: 0, maxSeeds: 50 })).toEqual({ seeds: null, power: expect.closeTo(0.05, 7), note: 'more than 50 seeds' });
  });

  it('needs 2 seeds for an effect too large to miss, and rejects a bad cap', () => {
    expect(seedsNeeded({ dz: 100 }).seeds).toBe(2);
    expect(() => seedsNeeded({ dz: 1, maxSeeds: 1 })).toThrow('seedsNeeded: maxSeeds must be an integer ≥ 2, got 1');
  });
});
