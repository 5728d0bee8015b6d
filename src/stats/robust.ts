import { mean } from './summarise.js';

/** A uniform generator on [0, 1), such as `createRng(seed, 'bootstrap')` from src/random.ts. */
export type Uniform = () => number;

/**
 * The interquartile mean: the mean of the middle half of the sorted values, dropping
 * floor(n / 4) from each end (the 25% trimmed mean recommended for few-run
 * evaluation by Agarwal et al. 2021, NeurIPS). Non-finite values are dropped; NaN if none remain.
 */
export function interquartileMean(values: readonly number[]): number {
  const sorted = values.filter(Number.isFinite).sort((x, y) => x - y);
  const cut = Math.floor(sorted.length / 4);
  return mean(sorted.slice(cut, sorted.length - cut));
}

/** A point estimate with a bootstrap confidence interval. */
export interface BootstrapInterval {
  readonly estimate: number;
  readonly low: number;
  readonly high: number;
}

/**
 * Percentile bootstrap CI of `statistic` (Efron & Tibshirani 1993, ch. 13; used for
 * aggregate scores by Agarwal et al. 2021): resample the values with replacement
 * `resamples` times and take the (1−level)/2 and 1−(1−level)/2 quantiles of the
 * statistic, interpolating linearly between order statistics. NaN bounds for n < 2.
 */
export function bootstrapCi(
  values: readonly number[],
  statistic: (sample: readonly number[]) => number,
  rng: Uniform,
  resamples = 2000,
  level = 0.95,
): BootstrapInterval {
  if (!Number.isInteger(resamples) || resamples < 1) throw new Error(`bootstrapCi: resamples must be a positive integer, got ${resamples}`);
  const data = values.filter(Number.isFinite);
  const estimate = statistic(data);
  if (data.length < 2) return { estimate, low: NaN, high: NaN };
  const stats = new Float64Array(resamples);
  const sample = new Array<number>(data.length);
  for (let r = 0; r < resamples; r++) {
    for (let i = 0; i < data.length; i++) sample[i] = data[Math.floor(rng() * data.length)];
    stats[r] = statistic(sample);
  }
  stats.sort();
  const alpha = 1 - level;
  return { estimate, low: quantile(stats, alpha / 2), high: quantile(stats, 1 - alpha / 2) };
}

/** Linear-interpolation quantile of sorted values (Hyndman & Fan 1996, definition 7). */
export function quantile(sorted: ArrayLike<number>, q: number): number {
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
