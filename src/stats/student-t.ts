import jStat from 'jstat';

/**
 * The two-sided critical value t_{1-(1-level)/2, df} of Student's t (Student 1908),
 * e.g. 2.262 for df = 9 at level 0.95. NaN when df < 1.
 */
export function tCritical(df: number, level = 0.95): number {
  if (!(level > 0 && level < 1)) throw new Error(`level must be in (0, 1), got ${level}`);
  if (!(df >= 1)) return NaN;
  return jStat.studentt.inv(1 - (1 - level) / 2, df);
}

/** The two-sided p-value P(|T| >= |t|) for T ~ Student's t with df degrees of freedom; NaN for undefined t or df < 1. */
export function tTwoSidedP(t: number, df: number): number {
  if (!Number.isFinite(t) || !(df >= 1)) return NaN;
  return Math.min(1, 2 * jStat.studentt.cdf(-Math.abs(t), df));
}
