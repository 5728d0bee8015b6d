import { existsSync, readFileSync } from 'node:fs';
import { writeFileAtomic } from './atomic-file.js';
import { cellPath, outputPath } from './layout.js';
import { outputOrder } from './output-order.js';
import type { Plan } from './plan-table.js';
import { formatResultsCsv, parseResultsCsv, type ResultRow, type ResultsTable } from './results-table.js';

/**
 * The rows of results.csv, from the stored cells alone: the scores.csv of every cell of
 * the plan that has one, cells in output order (each cell's rows are stored in output
 * order already). Unfinished and failed cells add nothing; cells outside the plan (of an
 * earlier config) are not read.
 */
export function readStoredResults(out: string, plan: Plan): ResultsTable {
  const rows: ResultRow[] = [];
  for (const entry of outputOrder(plan.entries, plan.varyKeys)) {
    const path = cellPath(out, entry.cell, 'scores');
    if (!existsSync(path)) continue;
    const table = parseResultsCsv(readFileSync(path, 'utf8'), path);
    if (JSON.stringify(table.varyKeys) !== JSON.stringify(plan.varyKeys)) {
      throw new Error(`${path}:1: vary columns ${table.varyKeys.join(', ') || '(none)'} differ from the plan's ${plan.varyKeys.join(', ') || '(none)'}`);
    }
    rows.push(...table.rows);
  }
  return { varyKeys: plan.varyKeys, rows };
}

/** Writes results.csv atomically; `crosswise run` and `crosswise report` both write it through here. */
export function writeResultsCsv(out: string, table: ResultsTable): string {
  const path = outputPath(out, 'results');
  writeFileAtomic(path, formatResultsCsv(table.rows, table.varyKeys));
  return path;
}
