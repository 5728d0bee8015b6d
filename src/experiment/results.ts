import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { csvLine } from '../results/csv.js';
import { RESULTS_COLUMNS, type Measurement, type ResultRow } from '../results/results-table.js';
import type { PlannedCell } from './plan.js';

/** A cell's measurements as results.csv rows. */
export function resultRows(cell: PlannedCell, measurements: readonly Measurement[]): ResultRow[] {
  return measurements.map((measurement) => ({
    cell: cell.id,
    learner: cell.learner.name,
    objective: cell.learner.objective,
    rule: cell.learner.rule,
    seed: cell.seed,
    vary: cell.vary,
    ...measurement,
  }));
}

/**
 * results.csv text from the stored scores of the given cells, in plan order (so the file
 * never depends on which cell finished first); cells without scores are left out.
 */
export function collectResults(out: string, cells: readonly PlannedCell[], varyKeys: readonly string[]): string {
  const header = csvLine([...RESULTS_COLUMNS, ...varyKeys]);
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
