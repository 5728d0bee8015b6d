import type { EpochLog } from '../learn/spec.js';
import type { Measurement } from '../results/results-table.js';

/** A cell as the runner announces it. */
export interface CellLabel {
  readonly index: number;
  readonly id: string;
  readonly learner: string;
  readonly seed: number;
  /** Values of the config's vary keys for this cell, as text. */
  readonly vary: Readonly<Record<string, string>>;
}

/** What the runner tells its listeners; the dashboard and the line logger both consume this. */
export type RunEvent =
  | { readonly type: 'sweep-start'; readonly name: string; readonly out: string; readonly total: number; readonly skipped: number; readonly jobs: number }
  | { readonly type: 'cell-start'; readonly cell: CellLabel; readonly worker: number }
  | { readonly type: 'epoch'; readonly cell: CellLabel; readonly worker: number; readonly log: EpochLog }
  | { readonly type: 'cell-done'; readonly cell: CellLabel; readonly worker: number; readonly seconds: number; readonly scores: readonly Measurement[] }
  | { readonly type: 'cell-failed'; readonly cell: CellLabel; readonly worker: number; readonly reason: string }
  | { readonly type: 'sweep-done'; readonly done: number; readonly failed: number; readonly seconds: number; readonly summary: string; readonly interrupted: boolean };

/** Something that receives run events. */
export type RunListener = (event: RunEvent) => void;
