import { mean, sampleSd } from './summarise.js';
import { tCritical, tTwoSidedP } from './student-t.js';

/** Relative spread of the differences below which it is rounding error, not variation (common practice). */
const ROUNDING = 1e-10;

/** A paired comparison of a against b (a − b), one pair per seed. */
export interface PairedComparison {
  /** Number of pairs where both values are finite. */
  readonly n: number;
  readonly meanDiff: number;
  readonly sdDiff: number;
  /** 95% CI of the mean difference (Student t, n − 1 df). */
  readonly ciLow: number;
  readonly ciHigh: number;
  /** Paired t statistic, meanDiff / (sdDiff / √n). */
  readonly t: number;
  /** Two-sided p-value of the paired t-test. */
  readonly p: number;
  /** Standardised mean difference of the pairs, meanDiff / sdDiff (Cohen 1988, d_z). */
  readonly dz: number;
  /** Why t, p or d_z are NaN: '' when they are defined. */
  readonly note: '' | 'fewer than 2 pairs' | 'differences have zero variance';
}

/**
 * Paired t-test of a against b (Student 1908), with pairs aligned by index (same seed).
 *
 * Pairs with a non-finite member are dropped. Defined behaviour at the edges, chosen to
 * never claim more than the data show:
 * - n < 2: meanDiff is the single difference (or NaN), everything else NaN.
 * - all differences equal (sdDiff = 0, or below 1e-10 · |meanDiff|, which is rounding
 *   error in a − b): the CI collapses to [meanDiff, meanDiff] and t, p and d_z are NaN —
 *   the t statistic would be 0/0 or ±∞ (or a huge number made of rounding error), and
 *   none of those is a test.
 */
export function pairedComparison(a: readonly number[], b: readonly number[], level = 0.95): PairedComparison {
  if (a.length !== b.length) throw new Error(`pairedComparison: a has ${a.length} values but b has ${b.length}`);
  const diffs: number[] = [];
  for (let i = 0; i < a.length; i++) {
    const d = a[i] - b[i];
    if (Number.isFinite(d)) diffs.push(d);
  }
  const n = diffs.length;
  const meanDiff = mean(diffs);
  if (n < 2) {
    return { n, meanDiff, sdDiff: NaN, ciLow: NaN, ciHigh: NaN, t: NaN, p: NaN, dz: NaN, note: 'fewer than 2 pairs' };
  }
  const sdDiff = sampleSd(diffs);
  if (sdDiff <= ROUNDING * Math.abs(meanDiff) || sdDiff === 0) {
    return { n, meanDiff, sdDiff, ciLow: meanDiff, ciHigh: meanDiff, t: NaN, p: NaN, dz: NaN, note: 'differences have zero variance' };
  }
  const se = sdDiff / Math.sqrt(n);
  const half = tCritical(n - 1, level) * se;
  const t = meanDiff / se;
  return {
    n, meanDiff, sdDiff,
    ciLow: meanDiff - half, ciHigh: meanDiff + half,
    t, p: tTwoSidedP(t, n - 1), dz: meanDiff / sdDiff, note: '',
  };
}
