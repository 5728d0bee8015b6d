import { isFinished } from './cell-folder.js';
import { readCellRecord } from './cell-record.js';

/** Where one planned cell stands in an output folder. */
export interface CellState {
  readonly index: number;
  readonly id: string;
  /** `missing`: no stored folder yet (never run, still running, or lost with its task). */
  readonly status: 'done' | 'failed' | 'missing';
  /** Why the cell failed; empty otherwise. */
  readonly reason: string;
}

/**
 * The state of each planned cell, in plan order. A stored cell.json that cannot be read
 * counts as failed, with the reading error as its reason, so that it is rerun only on request.
 */
export function cellStates(out: string, cells: readonly { readonly index: number; readonly id: string }[]): CellState[] {
  return cells.map(({ index, id }): CellState => {
    if (!isFinished(out, id)) return { index, id, status: 'missing', reason: '' };
    try {
      const record = readCellRecord(out, id);
      return { index, id, status: record.status, reason: record.reason };
    } catch (error) {
      return { index, id, status: 'failed', reason: (error as Error).message };
    }
  });
}
