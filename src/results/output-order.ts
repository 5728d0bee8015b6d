import type { NoiseSpec } from '../noise/spec.js';
import { MEASURES, type Measurement } from './results-table.js';
import type { PlanEntry } from './plan-table.js';

/**
 * The order in which every output lists cells: vary combinations, then learners, then
 * seeds, each in config order. The plan lists each of them first in config order
 * (combinations slowest, then seeds, then learners), so first appearance gives the rank.
 */
export function outputOrder(entries: readonly PlanEntry[], varyKeys: readonly string[]): PlanEntry[] {
  const combination = ranks(entries.map((e) => JSON.stringify(varyKeys.map((key) => e.vary[key]))));
  const learner = ranks(entries.map((e) => e.learner));
  const seed = ranks(entries.map((e) => String(e.seed)));
  return entries
    .map((entry, i) => ({ entry, key: [combination[i], learner[i], seed[i], entry.index] }))
    .sort((a, b) => compareKeys(a.key, b.key))
    .map(({ entry }) => entry);
}

/**
 * A cell's measurements in output order: targets in config order (CKA rows, target '-',
 * after them), then noises in config order, then severities in the noise's order, then
 * measures in MEASURES order; rows that tie keep the order they came in.
 */
export function orderCellRows<T extends Measurement>(rows: readonly T[], targets: readonly string[], noise: readonly NoiseSpec[]): T[] {
  const rank = (i: number) => (i < 0 ? AFTER_ALL : i);
  const key = (row: Measurement): number[] => {
    const n = noise.findIndex((entry) => entry.channel === row.channel && entry.kind === row.kind);
    const severity = row.severity == null || n < 0 ? -1 : noise[n].severities.indexOf(row.severity);
    return [rank(targets.indexOf(row.target)), rank(n), rank(severity), MEASURES.indexOf(row.measure)];
  };
  return rows.map((row, i) => ({ row, key: [...key(row), i] })).sort((a, b) => compareKeys(a.key, b.key)).map(({ row }) => row);
}

/** The rank of a value that the config does not list: after every listed one. */
const AFTER_ALL = Number.MAX_SAFE_INTEGER;

/** For each value, the position of its first appearance among the distinct values. */
function ranks(values: readonly string[]): number[] {
  const first = new Map<string, number>();
  for (const value of values) if (!first.has(value)) first.set(value, first.size);
  return values.map((value) => first.get(value) as number);
}

function compareKeys(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return 0;
}
