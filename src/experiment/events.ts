import type { EpochLog } from '../learn/spec.js';

/** A cell as the runner announces it. */
export interface CellLabel {
  readonly index: number;
  readonly id: string;
  readonly learner: string;
  readonly seed: number;
  /** Values of the config's vary keys for this cell, as text. */
  readonly vary: Readonly<Record<string, string>>;
}

/** One probe score as it becomes known. */
export interface ScoreRow {
  readonly learner: string;
  readonly seed: number;
  readonly target: string;
  readonly channel: string;
  readonly kind: string;
  readonly severity: number;
  readonly metric: string;
  readonly value: number;
}

/** What the runner tells its listeners; the dashboard and the line logger both consume this. */
export type RunEvent =
  | { readonly type: 'sweep-start'; readonly name: string; readonly out: string; readonly total: number; readonly skipped: number; readonly jobs: number }
  | { readonly type: 'cell-start'; readonly cell: CellLabel; readonly worker: number }
  | { readonly type: 'epoch'; readonly cell: CellLabel; readonly worker: number; readonly log: EpochLog }
  | { readonly type: 'cell-done'; readonly cell: CellLabel; readonly worker: number; readonly seconds: number; readonly scores: readonly ScoreRow[] }
  | { readonly type: 'cell-failed'; readonly cell: CellLabel; readonly worker: number; readonly reason: string }
  | { readonly type: 'sweep-done'; readonly done: number; readonly failed: number; readonly seconds: number; readonly summary: string; readonly interrupted: boolean };

/** Something that receives run events. */
export type RunListener = (event: RunEvent) => void;
