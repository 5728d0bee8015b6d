// Entry of a worker thread: loads the cell work module named in workerData and runs
// one cell per message, posting epoch logs as they come and the outcome at the end.
import { parentPort, workerData } from 'node:worker_threads';
import { failureReason, type CellOutcome, type CellWorkModule } from './cell-work.js';
import type { EpochLog } from '../learn/spec.js';
import type { PlannedCell } from './plan.js';

/** Messages a worker sends back to the pool. */
export type WorkerMessage =
  | { readonly type: 'epoch'; readonly log: EpochLog }
  | { readonly type: 'done'; readonly outcome: CellOutcome }
  | { readonly type: 'failed'; readonly reason: string };

const port = parentPort;
if (port == null) throw new Error('worker.ts must run in a worker thread');
const { workModule } = workerData as { workModule: string };
const { cellWork } = (await import(workModule)) as CellWorkModule;

port.on('message', (cell: PlannedCell) => {
  const post = (message: WorkerMessage) => port.postMessage(message);
  cellWork(cell, (log) => post({ type: 'epoch', log })).then(
    (outcome) => post({ type: 'done', outcome }),
    (error: unknown) => post({ type: 'failed', reason: failureReason(error) }),
  );
});
