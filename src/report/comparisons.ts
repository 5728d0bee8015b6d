import { holm } from '../stats/holm.js';
import { pairedComparison, type PairedComparison } from '../stats/paired.js';
import type { ComparisonRow } from '../results/comparisons-table.js';
import type { ScoreRow } from '../results/results-table.js';
import { bySeed, combinations, scoreGroups, severities, unique } from './groups.js';

/** One learner against the baseline at one target, noise and severity, paired by seed. */
export interface Comparison extends PairedComparison, ComparisonRow {
  readonly combination: number;
  readonly severity: number;
  /** Holm-adjusted p across every comparison of the report (Holm 1979). */
  readonly pHolm: number;
}

/**
 * Every paired comparison of a learner's probe score with the baseline's, Holm-adjusted
 * together across the whole report (all combinations, targets, noises and severities):
 * for now that one family is the primary family of every comparison.
 */
export function compareWithBaseline(rows: readonly ScoreRow[], varyKeys: readonly string[], baseline: string): Comparison[] {
  const raw: Omit<Comparison, 'pHolm'>[] = [];
  for (const combo of combinations(rows, varyKeys)) {
    const learners = unique(combo.rows.map((r) => r.learner)).filter((l) => l !== baseline);
    for (const { target, metric, channel, kind, rows: noisy } of scoreGroups(combo.rows)) {
      for (const learner of learners) {
        for (const severity of severities(noisy)) {
          const at = noisy.filter((r) => r.severity === severity);
          const base = bySeed(at, (r) => r.learner === baseline);
          const mine = bySeed(at, (r) => r.learner === learner);
          const seeds = [...mine.keys()].filter((s) => base.has(s)).sort((a, b) => a - b);
          if (seeds.length === 0) continue;
          const test = pairedComparison(seeds.map((s) => mine.get(s)!), seeds.map((s) => base.get(s)!));
          raw.push({ ...test, combination: combo.index, vary: combo.values, learner, baseline, target, channel, kind, severity,
            measure: 'score', family: 'primary', metric });
        }
      }
    }
  }
  const hypothesis = hypothesisKeys(raw);
  const distinct = unique(hypothesis);
  const pOf = new Map(raw.map((c, i) => [hypothesis[i], c.p]));
  const adjusted = new Map(holm(distinct.map((h) => pOf.get(h)!)).map((p, i) => [distinct[i], p]));
  return raw.map((c, i) => ({ ...c, pHolm: adjusted.get(hypothesis[i])! }));
}

/**
 * One key per tested hypothesis. Severity 0 is the clean score, stored once per noise:
 * identical clean comparisons are one hypothesis, so they count once in Holm's m and
 * share its adjusted p.
 */
function hypothesisKeys(comparisons: readonly Omit<Comparison, 'pHolm'>[]): string[] {
  return comparisons.map((c, i) => (c.severity === 0
    ? JSON.stringify([c.combination, c.learner, c.target, c.metric, c.n, c.meanDiff, c.sdDiff]) : `#${i}`));
}

/** Holm's m: the number of distinct hypotheses with a defined p-value. */
export function holmFamilySize(comparisons: readonly Comparison[]): number {
  const keys = hypothesisKeys(comparisons);
  return unique(keys.filter((_, i) => !Number.isNaN(comparisons[i].p))).length;
}

/** Whether a comparison shows a reliable difference: Holm p < 0.05 and a CI that excludes 0. */
export function isReliable(c: Comparison): boolean {
  return c.pHolm < 0.05 && (c.ciLow > 0 || c.ciHigh < 0);
}
