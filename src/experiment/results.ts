import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ScoreRow } from './events.js';
import type { PlannedCell } from './plan.js';

/** The fixed leading columns of results.csv (DESIGN, Output layout); vary keys follow. */
export const RESULT_COLUMNS = ['cell', 'learner', 'objective', 'rule', 'seed', 'target', 'channel', 'kind', 'severity', 'metric', 'value'] as const;

/** One row of results.csv: a score with the cell it came from. */
export interface ResultRow extends ScoreRow {
  readonly cell: string;
  readonly objective: string;
  readonly rule: string;
  readonly vary: Readonly<Record<string, string>>;
}

/** A cell's scores as results rows. */
export function resultRows(cell: PlannedCell, scores: readonly ScoreRow[]): ResultRow[] {
  return scores.map((score) => ({ ...score, cell: cell.id, objective: cell.learner.objective, rule: cell.learner.rule, vary: cell.vary }));
}

/** Rows as CSV text: the fixed columns, then one per vary key. */
export function formatResults(rows: readonly ResultRow[], varyKeys: readonly string[]): string {
  let text = csvLine([...RESULT_COLUMNS, ...varyKeys]);
  for (const r of rows) {
    const fixed = [r.cell, r.learner, r.objective, r.rule, r.seed, r.target, r.channel, r.kind, r.severity, r.metric, r.value];
    text += csvLine([...fixed.map(String), ...varyKeys.map((key) => r.vary[key] ?? '')]);
  }
  return text;
}

/**
 * results.csv text from the stored scores of the given cells, in plan order (so the file
 * never depends on which cell finished first); cells without scores are left out.
 */
export function collectResults(out: string, cells: readonly PlannedCell[], varyKeys: readonly string[]): string {
  const header = csvLine([...RESULT_COLUMNS, ...varyKeys]);
  let text = header;
  for (const cell of cells) {
    const path = join(out, 'cells', cell.id, 'scores.csv');
    if (!existsSync(path)) continue;
    const stored = readFileSync(path, 'utf8');
    if (!stored.startsWith(header)) throw new Error(`${path}:1: expected the header ${header.trim()}`);
    text += stored.slice(header.length);
  }
  return text;
}

/** One CSV record, quoting fields that hold a comma, quote or line break (RFC 4180, section 2). */
export function csvLine(fields: readonly string[]): string {
  return `${fields.map((field) => (/[",\r\n]/.test(field) ? `"${field.replace(/"/g, '""')}"` : field)).join(',')}\n`;
}
