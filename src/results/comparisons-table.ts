import { csvLine } from './csv.js';
import { formatCsvNumber, formatOptionalNumber } from './csv-number.js';
import type { Measure } from './results-table.js';

/**
 * Hypothesis families of comparisons.csv: `primary` is the family Holm adjusts over for
 * the report's main question, `exploratory` is adjusted within its target and noise, and
 * `identical` marks a comparison equal in every seed (no p).
 */
export const FAMILIES = ['primary', 'exploratory', 'identical'] as const;
export type Family = (typeof FAMILIES)[number];

/**
 * The columns of comparisons.csv, then one per vary key: what is compared (learner,
 * baseline, target, noise, severity, measure), the family its Holm adjustment ran in,
 * the metric, then the paired statistics.
 */
export const COMPARISON_COLUMNS = [
  'learner', 'baseline', 'target', 'channel', 'kind', 'severity', 'measure', 'family', 'metric',
  'mean_diff', 'ci_low', 'ci_high', 'p', 'p_holm', 'd_z', 'n_seeds',
] as const;

/** One learner against the baseline, paired by seed: one row of comparisons.csv. */
export interface ComparisonRow {
  readonly learner: string;
  readonly baseline: string;
  readonly target: string;
  readonly channel: string;
  readonly kind: string;
  /** Null for the per-seed measures, which span every severity. */
  readonly severity: number | null;
  readonly measure: Measure;
  readonly family: Family;
  readonly metric: string;
  /** Mean of learner − baseline over the paired seeds, with its 95% CI. */
  readonly meanDiff: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  /** Paired t-test p, and Holm-adjusted within the family; NaN (an empty field) when not computed. */
  readonly p: number;
  readonly pHolm: number;
  readonly dz: number;
  /** Number of paired seeds. */
  readonly n: number;
  readonly vary: Readonly<Record<string, string>>;
}

/** comparisons.csv text; undefined numbers are empty fields. */
export function formatComparisonsCsv(rows: readonly ComparisonRow[], varyKeys: readonly string[]): string {
  let text = csvLine([...COMPARISON_COLUMNS, ...varyKeys]);
  for (const c of rows) {
    text += csvLine([
      c.learner, c.baseline, c.target, c.channel, c.kind, formatOptionalNumber(c.severity), c.measure, c.family, c.metric,
      ...[c.meanDiff, c.ciLow, c.ciHigh, c.p, c.pHolm, c.dz].map(formatCsvNumber), String(c.n),
      ...varyKeys.map((k) => c.vary[k] ?? ''),
    ]);
  }
  return text;
}
