import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { dirname, join } from 'node:path';
import type { EpochLog } from '../learn/spec.js';
import type { CellOutcome } from './cell-work.js';
import type { PlannedCell } from './plan.js';
import { csvLine } from '../results/csv.js';
import { encodeNpy } from '../results/npy.js';
import { formatResultsCsv } from '../results/results-table.js';
import { resultRows } from './results.js';

/** What happened to a cell, as stored in its cell.json. */
export interface CellRecord {
  readonly id: string;
  readonly index: number;
  readonly learner: string;
  readonly seed: number;
  readonly vary: Readonly<Record<string, string>>;
  readonly status: 'done' | 'failed';
  /** Why the cell failed; empty when it is done. */
  readonly reason: string;
  readonly seconds: { readonly collect: number; readonly train: number; readonly probe: number; readonly total: number };
  readonly versions: Readonly<Record<string, string>>;
  readonly finishedAt: string;
  readonly settings: Omit<PlannedCell, 'index' | 'id' | 'vary'>;
}

/** The folder of one cell. */
export function cellDir(out: string, id: string): string {
  return join(out, 'cells', id);
}

/** Whether a cell is finished (done or failed); only a complete folder ever exists under its id. */
export function isFinished(out: string, id: string): boolean {
  return existsSync(join(cellDir(out, id), 'cell.json'));
}

/** The stored record of a finished cell. */
export function readCellRecord(out: string, id: string): CellRecord {
  return JSON.parse(readFileSync(join(cellDir(out, id), 'cell.json'), 'utf8')) as CellRecord;
}

/** What a cell produced: an outcome when done, or the reason and the epochs it got through. */
export type CellResult =
  | { readonly status: 'done'; readonly outcome: CellOutcome; readonly totalSeconds: number }
  | { readonly status: 'failed'; readonly reason: string; readonly log: readonly EpochLog[]; readonly totalSeconds: number };

/**
 * Stores a finished cell: every file is written into a temporary folder that is then
 * renamed to `cells/<id>`, so a killed process never leaves a partly written cell.
 */
export function storeCell(out: string, cell: PlannedCell, result: CellResult, varyKeys: readonly string[]): CellRecord {
  const { index: _index, id: _id, vary: _vary, ...settings } = cell;
  const outcome = result.status === 'done' ? result.outcome : undefined;
  const record: CellRecord = {
    id: cell.id,
    index: cell.index,
    learner: cell.learner.name,
    seed: cell.seed,
    vary: cell.vary,
    status: result.status,
    reason: result.status === 'failed' ? result.reason : '',
    seconds: { ...(outcome?.seconds ?? { collect: 0, train: 0, probe: 0 }), total: result.totalSeconds },
    versions: { node: process.versions.node, crosswise: crosswiseVersion(), ...outcome?.versions },
    finishedAt: new Date().toISOString(),
    settings,
  };
  const files: Record<string, string | Uint8Array> = {
    'cell.json': `${JSON.stringify(record, null, 2)}\n`,
    'train.csv': trainCsv(outcome?.log ?? (result.status === 'failed' ? result.log : [])),
  };
  if (outcome != null) {
    files['scores.csv'] = formatResultsCsv(resultRows(cell, outcome.rows), varyKeys);
    for (const [name, array] of Object.entries(outcome.arrays)) files[`${name}.npy`] = encodeNpy(array.data, array.shape);
  }
  commitFolder(cellDir(out, cell.id), files);
  return record;
}

function commitFolder(target: string, files: Readonly<Record<string, string | Uint8Array>>): void {
  const temporary = join(dirname(target), `${PARTIAL}${hostname()}-${process.pid}-${randomUUID()}`);
  mkdirSync(temporary, { recursive: true });
  for (const [name, content] of Object.entries(files)) writeFileSync(join(temporary, name), content);
  try {
    renameSync(temporary, target);
  } catch (error) {
    rmSync(temporary, { recursive: true, force: true });
    // Another process finished the same cell first; its copy holds the same numbers.
    if (!existsSync(join(target, 'cell.json'))) throw error;
  }
}

// Temporary cell folders are named .partial-<host>-<pid>-<uuid>, so a cleanup only
// touches those of dead processes on this machine, never those of a running task.
const PARTIAL = '.partial-';

/** Removes temporary folders that killed processes on this machine left behind. */
export function removePartialCells(out: string): void {
  const cells = join(out, 'cells');
  if (!existsSync(cells)) return;
  const mine = `${PARTIAL}${hostname()}-`;
  for (const entry of readdirSync(cells)) {
    if (!entry.startsWith(mine)) continue;
    const pid = Number(entry.slice(mine.length).split('-')[0]);
    if (!isAlive(pid)) rmSync(join(cells, entry), { recursive: true, force: true });
  }
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0); // signal 0 only checks that the process exists
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** train.csv: one line per epoch, with one alignment column per weight layer when recorded. */
export function trainCsv(log: readonly EpochLog[]): string {
  const layers = Math.max(0, ...log.map((entry) => entry.alignmentDeg.length));
  const alignment = Array.from({ length: layers }, (_, i) => `alignment_deg_${i + 1}`);
  let text = csvLine(['epoch', 'train_loss', 'validation_loss', 'seconds', ...alignment]);
  for (const entry of log) {
    const angles = Array.from({ length: layers }, (_, i) => String(entry.alignmentDeg[i] ?? ''));
    text += csvLine([entry.epoch, entry.trainLoss, entry.validationLoss, entry.seconds].map(String).concat(angles));
  }
  return text;
}

let version: string | undefined;
function crosswiseVersion(): string {
  version ??= (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
  return version;
}
