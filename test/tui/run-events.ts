import type { CellLabel, RunEvent } from '../../src/experiment/events.js';
import type { Measurement } from '../../src/results/results-table.js';

/** A cell label for dashboard tests. */
export function cell(index: number, learner: string, seed: number): CellLabel {
  return { index, id: `c${index}`, learner, seed, vary: {} };
}

/** A probe score for dashboard tests (the parameter is σ of the severity table's gaussian row). */
export function score(severity: number, value: number, target = 'wall_ahead'): Measurement {
  const parameter = [0, 0.25, 0.5, 1, 2, 4][severity];
  return { target, channel: 'sight', kind: 'gaussian', severity, parameter, measure: 'score', metric: 'accuracy', value };
}

/** A sweep of 6 cells on 2 workers: two cells finish, one fails, two are running. */
export const SWEEP: readonly RunEvent[] = [
  { type: 'sweep-start', name: 'demo', out: 'runs/demo', total: 6, skipped: 0, jobs: 2 },
  { type: 'cell-start', cell: cell(0, 'sound-from-sight', 1), worker: 1 },
  { type: 'cell-start', cell: cell(1, 'autoencoder', 1), worker: 2 },
  { type: 'cell-done', cell: cell(0, 'sound-from-sight', 1), worker: 1, seconds: 10, scores: [score(0, 0.9), score(3, 0.7)] },
  { type: 'cell-start', cell: cell(2, 'sound-from-sight', 2), worker: 1 },
  { type: 'cell-done', cell: cell(1, 'autoencoder', 1), worker: 2, seconds: 20, scores: [score(0, 0.8), score(3, 0.4)] },
  { type: 'cell-start', cell: cell(3, 'autoencoder', 2), worker: 2 },
  { type: 'cell-failed', cell: cell(3, 'autoencoder', 2), worker: 2, reason: 'loss became NaN' },
  { type: 'cell-start', cell: cell(4, 'autoencoder', 3), worker: 2 },
  { type: 'epoch', cell: cell(2, 'sound-from-sight', 2), worker: 1, log: { epoch: 1, trainLoss: 0.5, validationLoss: 0.6, seconds: 1, alignmentDeg: [] } },
  { type: 'epoch', cell: cell(2, 'sound-from-sight', 2), worker: 1, log: { epoch: 2, trainLoss: 0.3, validationLoss: 0.4, seconds: 1, alignmentDeg: [] } },
  { type: 'epoch', cell: cell(2, 'sound-from-sight', 2), worker: 1, log: { epoch: 3, trainLoss: 0.1, validationLoss: 0.2, seconds: 1, alignmentDeg: [] } },
];
