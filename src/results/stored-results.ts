import { readFileSync } from 'node:fs';
import { writeFileAtomic } from './atomic-file.js';
import type { CellIdentity } from './cell-identity.js';
import type { CellRecord } from './cell-record.js';
import { cellPath, outputPath } from './layout.js';
import { outputOrder } from './output-order.js';
import type { Plan, PlanEntry } from './plan-table.js';
import { formatResultsCsv, parseResultsCsv, type ResultRow, type ResultsTable } from './results-table.js';
import { inspectStoredCell, type CellFault } from './stored-cell.js';

/** A stored cell of the plan that passed inspection. */
export interface TrustedCell {
  readonly entry: PlanEntry;
  readonly record: CellRecord;
}

/** The plan's trusted cells in output order, and the rows of results.csv they give. */
export interface StoredRun {
  readonly cells: readonly TrustedCell[];
  readonly results: ResultsTable;
}

/** Told about each stored cell of the plan that cannot be trusted, which is then left out. */
export type OnDamaged = (id: string, fault: CellFault) => void;

/**
 * The stored cells of a plan and the rows of results.csv, from the stored cells alone:
 * the scores.csv of every trusted done cell of the plan, cells in output order (each
 * cell's rows are stored in output order already). Unfinished and failed cells add no
 * rows; damaged cells (see inspectStoredCell) are passed to `onDamaged` and left out;
 * cells outside the plan (of an earlier config) and temporary folders are never read.
 * `identityOf` gives the settings a cell must have been stored with, when known.
 */
export function readStoredRun(out: string, plan: Plan, onDamaged: OnDamaged, identityOf?: (entry: PlanEntry) => CellIdentity | undefined): StoredRun {
  const cells: TrustedCell[] = [];
  const rows: ResultRow[] = [];
  for (const entry of outputOrder(plan.entries, plan.varyKeys)) {
    const stored = inspectStoredCell(out, entry.cell, identityOf?.(entry));
    if (stored.state === 'damaged') onDamaged(entry.cell, stored.fault);
    if (stored.state !== 'trusted') continue;
    if (stored.record.status === 'done') {
      const scores = readScores(out, entry.cell, plan.varyKeys);
      if (scores instanceof Error) {
        onDamaged(entry.cell, { file: 'scores.csv', fault: scores.message });
        continue;
      }
      rows.push(...scores);
    }
    cells.push({ entry, record: stored.record });
  }
  return { cells, results: { varyKeys: plan.varyKeys, rows } };
}

/** A done cell's rows, or the one-line reason they cannot be read. */
function readScores(out: string, id: string, varyKeys: readonly string[]): readonly ResultRow[] | Error {
  const path = cellPath(out, id, 'scores');
  try {
    const table = parseResultsCsv(readFileSync(path, 'utf8'), 'scores.csv');
    if (JSON.stringify(table.varyKeys) !== JSON.stringify(varyKeys)) {
      return new Error(`has vary columns ${table.varyKeys.join(', ') || '(none)'}, the plan ${varyKeys.join(', ') || '(none)'}`);
    }
    const foreign = table.rows.find((row) => row.cell !== id);
    return foreign == null ? table.rows : new Error(`holds a row of cell ${foreign.cell}`);
  } catch (error) {
    return new Error((error as Error).message.replace(/^scores\.csv:(\d+:)?\s*/, (_, line: string | undefined) => (line == null ? '' : `line ${line} `)));
  }
}

/** Writes results.csv atomically; `crosswise run` and `crosswise report` both write it through here. */
export function writeResultsCsv(out: string, table: ResultsTable): string {
  const path = outputPath(out, 'results');
  writeFileAtomic(path, formatResultsCsv(table.rows, table.varyKeys));
  return path;
}
