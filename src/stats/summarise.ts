import { tCritical } from './student-t.js';

/** Mean, spread and 95% Student-t confidence interval of one quantity across seeds. */
export interface Summary {
  /** Number of finite values used; NaN and ±Infinity are left out. */
  readonly n: number;
  readonly mean: number;
  /** Sample standard deviation (n − 1 in the denominator); NaN when n < 2. */
  readonly sd: number;
  /** 95% CI bounds, mean ∓ t_{0.975, n−1} · sd / √n; NaN when n < 2. */
  readonly ciLow: number;
  readonly ciHigh: number;
}

/** Arithmetic mean (NaN for no values). */
export function mean(values: readonly number[]): number {
  let sum = 0;
  for (const v of values) sum += v;
  return values.length === 0 ? NaN : sum / values.length;
}

/** Sample standard deviation with Bessel's correction (NaN when fewer than 2 values). */
export function sampleSd(values: readonly number[]): number {
  if (values.length < 2) return NaN;
  const m = mean(values);
  let ss = 0;
  for (const v of values) ss += (v - m) ** 2;
  return Math.sqrt(ss / (values.length - 1));
}

/**
 * Mean, sd and the 95% confidence interval of the mean from Student's t (Student 1908).
 * Non-finite values are dropped first (a failed measurement is not a zero). With one
 * value the mean is that value and sd and CI are NaN; with none, everything is NaN.
 */
export function summarise(values: readonly number[], level = 0.95): Summary {
  const finite = values.filter(Number.isFinite);
  const n = finite.length;
  const m = mean(finite);
  const sd = sampleSd(finite);
  const half = tCritical(n - 1, level) * sd / Math.sqrt(n);
  return { n, mean: m, sd, ciLow: m - half, ciHigh: m + half };
}
