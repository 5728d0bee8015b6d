import type { EpochLog } from '../learn/spec.js';
import type { NpyArray } from '../results/npy.js';
import type { Measurement } from '../results/results-table.js';
import type { PlannedCell } from './plan.js';

/** What one finished cell hands back to the runner, which stores it. */
export interface CellOutcome {
  readonly rows: readonly Measurement[];
  readonly log: readonly EpochLog[];
  readonly seconds: { readonly collect: number; readonly train: number; readonly probe: number };
  /** Versions of the libraries that computed the numbers, e.g. `{ tfjs: '4.22.0' }`. */
  readonly versions: Readonly<Record<string, string>>;
  /** Arrays to store as `<name>.npy` beside the scores (test features, latents). */
  readonly arrays: Readonly<Record<string, NpyArray>>;
}

/**
 * Computes one cell from its settings alone; throws when the cell cannot finish
 * (the runner stores it as failed with the error's message).
 */
export type CellWork = (cell: PlannedCell, onEpoch: (log: EpochLog) => void) => Promise<CellOutcome>;

/** A module that a worker loads to do cells: it exports `cellWork`. */
export interface CellWorkModule {
  readonly cellWork: CellWork;
}

/** The production cell work: collect, train, probe. */
export const PIPELINE_MODULE = new URL('./cell-pipeline.ts', import.meta.url).href;

/** One line saying why a cell failed, from what its work threw. */
export function failureReason(error: unknown): string {
  if (!(error instanceof Error)) return String(error);
  const prefix = error.name === 'Error' ? '' : `${error.name}: `;
  return `${prefix}${error.message}`.split('\n')[0];
}
