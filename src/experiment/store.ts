import { readFileSync } from 'node:fs';
import type { EpochLog } from '../learn/spec.js';
import { commitCellFolder } from '../results/cell-folder.js';
import { cellIdentity } from '../results/cell-identity.js';
import { formatCellRecord, type CellRecord } from '../results/cell-record.js';
import { RESULTS_FORMAT_VERSION } from '../results/format-version.js';
import { CELL_FILES } from '../results/layout.js';
import { encodeNpy } from '../results/npy.js';
import { orderCellRows } from '../results/output-order.js';
import { formatResultsCsv, type Measurement, type ResultRow } from '../results/results-table.js';
import { formatTrainCsv } from '../results/train-table.js';
import type { CellOutcome } from './cell-work.js';
import { cellSettings, type PlannedCell } from './plan.js';

/** What a cell produced: an outcome when done, or the reason and the epochs it got through. */
export type CellResult =
  | { readonly status: 'done'; readonly outcome: CellOutcome; readonly totalSeconds: number }
  | { readonly status: 'failed'; readonly reason: string; readonly log: readonly EpochLog[]; readonly totalSeconds: number };

/** Stores a finished cell (done or failed) as one folder committed at once; returns its record. */
export function storeCell(out: string, cell: PlannedCell, result: CellResult, varyKeys: readonly string[]): CellRecord {
  const outcome = result.status === 'done' ? result.outcome : undefined;
  const record = cellRecord(cell, result);
  const files: Record<string, string | Uint8Array> = {
    [CELL_FILES.record]: formatCellRecord(record),
    [CELL_FILES.train]: formatTrainCsv(outcome?.log ?? (result.status === 'failed' ? result.log : [])),
  };
  if (outcome != null) {
    const rows = orderCellRows(outcome.rows, cell.probe.targets, cell.noise);
    files[CELL_FILES.scores] = formatResultsCsv(resultRows(cell, rows), varyKeys);
    for (const [name, array] of Object.entries(outcome.arrays)) files[`${name}.npy`] = encodeNpy(array.data, array.shape);
  }
  commitCellFolder(out, cell.id, files);
  return record;
}

function cellRecord(cell: PlannedCell, result: CellResult): CellRecord {
  const outcome = result.status === 'done' ? result.outcome : undefined;
  return {
    format_version: RESULTS_FORMAT_VERSION,
    id: cell.id,
    index: cell.index,
    status: result.status,
    reason: result.status === 'failed' ? result.reason : '',
    identity: cellIdentity(cellSettings(cell)),
    backend: cell.backend,
    world_path: cell.world.path,
    output: { save_features: cell.output.saveFeatures, align_every: cell.output.alignEvery },
    seconds: { ...(outcome?.seconds ?? { collect: 0, train: 0, probe: 0 }), total: result.totalSeconds },
    versions: { node: process.versions.node, crosswise: crosswiseVersion(), ...outcome?.versions },
    finished_at: new Date().toISOString(),
  };
}

/** A cell's measurements as results rows. */
function resultRows(cell: PlannedCell, measurements: readonly Measurement[]): ResultRow[] {
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

let version: string | undefined;
/** The version in package.json, read once. */
export function crosswiseVersion(): string {
  version ??= (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
  return version;
}
