import { inspectStoredCell, cellFaultLine } from './stored-cell.js';

/** Where one planned cell stands in an output folder. */
export interface CellState {
  readonly index: number;
  readonly id: string;
  /**
   * `missing`: no trusted stored folder (never run, still running, lost with its task, or
   * damaged: the next `run` or `cell` moves a damaged one aside and computes it again).
   */
  readonly status: 'done' | 'failed' | 'missing';
  /** Why the cell failed, or what is wrong with a damaged one; empty otherwise. */
  readonly reason: string;
}

/** The state of each planned cell, in plan order; a cell is done or failed only when it can be trusted (inspectStoredCell). */
export function cellStates(out: string, cells: readonly { readonly index: number; readonly id: string }[]): CellState[] {
  return cells.map(({ index, id }): CellState => {
    const stored = inspectStoredCell(out, id);
    if (stored.state === 'trusted') return { index, id, status: stored.record.status, reason: stored.record.reason };
    return { index, id, status: 'missing', reason: stored.state === 'damaged' ? cellFaultLine(id, stored.fault, 'to be computed again') : '' };
  });
}
