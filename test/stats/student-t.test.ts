import { describe, expect, it } from 'vitest';
import { tCritical, tTwoSidedP } from '../../src/stats/student-t.js';

describe('tCritical', () => {
  // Two-sided 95% critical values t(0.975, df) from standard statistical tables
  // (e.g. Fisher & Yates, Statistical Tables, Table III), to 1e-3.
  const table: readonly [number, number][] = [
    [1, 12.7062], [2, 4.3027], [4, 2.7764], [9, 2.2622], [19, 2.0930], [29, 2.0452],
  ];
  for (const [df, expected] of table) {
    it(`gives ${expected} for df = ${df}`, () => {
      expect(Math.abs(tCritical(df) - expected)).toBeLessThan(1e-3);
    });
  }

  it('is NaN when there are no degrees of freedom', () => {
    expect(tCritical(0)).toBeNaN();
  });

  it('rejects a level outside (0, 1)', () => {
    expect(() => tCritical(5, 1.5)).toThrow('level must be in (0, 1), got 1.5');
  });
});

describe('tTwoSidedP', () => {
  it('gives 0.05 at the tabled critical value t = 2.2622, df = 9 (standard tables), to 1e-4', () => {
    expect(tTwoSidedP(2.2622, 9)).toBeCloseTo(0.05, 4);
  });

  it('gives 1 at t = 0 and NaN for an undefined statistic', () => {
    expect(tTwoSidedP(0, 4)).toBeCloseTo(1, 12);
    expect(tTwoSidedP(NaN, 4)).toBeNaN();
  });
});
