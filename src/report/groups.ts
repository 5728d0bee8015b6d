import type { MeasureRow, ScoreRow } from '../results/results-table.js';

/** One combination of vary values, with the result rows measured under it. */
export interface Combination {
  /** 1-based position in order of first appearance in results.csv. */
  readonly index: number;
  readonly values: Readonly<Record<string, string>>;
  readonly rows: readonly ScoreRow[];
  /** Its per-seed robustness measures. */
  readonly measures: readonly MeasureRow[];
}

/** A corrupted channel and the kind of corruption. */
export interface Noise {
  readonly channel: string;
  readonly kind: string;
}

/** Identity of a combination's vary values, usable as a map key. */
export function comboKey(values: Readonly<Record<string, string>>, varyKeys: readonly string[]): string {
  return JSON.stringify(varyKeys.map((k) => values[k] ?? ''));
}

/** Splits score rows and measure rows by their vary values (one combination when there are no vary keys). */
export function combinations(rows: readonly ScoreRow[], varyKeys: readonly string[], measures: readonly MeasureRow[] = []): Combination[] {
  const byKey = new Map<string, ScoreRow[]>();
  for (const r of rows) {
    const key = comboKey(r.vary, varyKeys);
    const list = byKey.get(key) ?? [];
    list.push(r);
    byKey.set(key, list);
  }
  return [...byKey.entries()].map(([key, list], i) => ({
    index: i + 1, values: list[0].vary, rows: list, measures: measures.filter((m) => comboKey(m.vary, varyKeys) === key),
  }));
}

/** Distinct values in order of first appearance. */
export function unique<T>(items: Iterable<T>): T[] {
  return [...new Set(items)];
}

/** Distinct noises (channel, kind) in order of first appearance. */
export function noises(rows: readonly Noise[]): Noise[] {
  const seen = new Map<string, Noise>();
  for (const r of rows) {
    const key = `${r.channel}\u0000${r.kind}`;
    if (!seen.has(key)) seen.set(key, { channel: r.channel, kind: r.kind });
  }
  return [...seen.values()];
}

/** The value per seed of the rows that pass `match` (the last row wins for a repeated seed). */
export function bySeed<T extends { readonly seed: number; readonly value: number }>(rows: readonly T[], match: (r: T) => boolean): Map<number, number> {
  const values = new Map<number, number>();
  for (const r of rows) if (match(r)) values.set(r.seed, r.value);
  return values;
}

/** The probe score metric of a target's rows: accuracy for categorical targets, r2 for continuous ones. */
export function scoreMetric(rows: readonly ScoreRow[], target: string): 'r2' | 'accuracy' | null {
  const metrics = new Set(rows.filter((r) => r.target === target).map((r) => r.metric));
  return metrics.has('accuracy') ? 'accuracy' : metrics.has('r2') ? 'r2' : null;
}

/** Severities present in the rows, ascending. */
export function severities(rows: readonly ScoreRow[]): number[] {
  return unique(rows.map((r) => r.severity)).sort((a, b) => a - b);
}

/** One target's probe-score rows under one noise: what a score table, a robustness plot and a set of comparisons describe. */
export interface ScoreGroup extends Noise {
  readonly target: string;
  readonly metric: 'r2' | 'accuracy';
  readonly rows: readonly ScoreRow[];
  /** The per-seed measures computed from these scores. */
  readonly measures: readonly MeasureRow[];
}

/**
 * A combination's score rows split by target, then by noise, in order of first
 * appearance, each with its measure rows; targets without a probe score (CKA) are left out.
 */
export function scoreGroups(combo: Pick<Combination, 'rows' | 'measures'>): ScoreGroup[] {
  const groups: ScoreGroup[] = [];
  const { rows } = combo;
  for (const target of unique(rows.map((r) => r.target))) {
    const metric = scoreMetric(rows, target);
    if (metric == null) continue;
    const scored = rows.filter((r) => r.target === target && r.metric === metric);
    for (const { channel, kind } of noises(scored)) {
      const here = (r: ScoreRow | MeasureRow) => r.target === target && r.metric === metric && r.channel === channel && r.kind === kind;
      groups.push({ target, metric, channel, kind, rows: scored.filter(here), measures: combo.measures.filter(here) });
    }
  }
  return groups;
}
