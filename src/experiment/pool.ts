import { Worker } from 'node:worker_threads';
import type { EpochLog } from '../learn/spec.js';
import type { PlannedCell } from './plan.js';
import type { CellResult } from './store.js';
import type { WorkerMessage } from './worker.js';

/** What the pool reports about each cell it runs; `worker` numbers the thread from 1. */
export interface PoolCallbacks {
  readonly onStart: (cell: PlannedCell, worker: number) => void;
  readonly onEpoch: (cell: PlannedCell, worker: number, log: EpochLog) => void;
  readonly onFinish: (cell: PlannedCell, worker: number, result: CellResult) => void;
}

/** How the pool runs cells. */
export interface PoolOptions {
  readonly jobs: number;
  /** URL of the module exporting `cellWork`. */
  readonly workModule: string;
  /** Stops the pool gently: nothing more starts, running cells finish. */
  readonly signal?: AbortSignal;
  /** Stops the pool at once: running cells are abandoned (their threads terminated). */
  readonly abandon?: AbortSignal;
}

const WORKER_ENTRY = new URL('./worker.js', import.meta.url);
/** Whether this module is the TypeScript source (tsx, vitest) rather than the compiled dist/. */
const RUNNING_SOURCES = import.meta.url.endsWith('.ts');

/**
 * Runs cells in index order on up to `jobs` worker threads, one cell per thread at a time;
 * resolves when every started cell has finished (or was abandoned) and nothing is left to start.
 */
export async function runOnPool(cells: readonly PlannedCell[], options: PoolOptions, callbacks: PoolCallbacks): Promise<void> {
  const queue = [...cells];
  const threads = Math.max(1, Math.min(options.jobs, queue.length));
  const workers: Worker[] = [];
  const abandoned = new Promise<void>((resolve) => {
    if (options.abandon?.aborted === true) resolve();
    options.abandon?.addEventListener('abort', () => resolve(), { once: true });
  });
  const slot = async (worker: number): Promise<void> => {
    let thread: Worker | undefined;
    for (let cell = queue.shift(); cell != null && options.signal?.aborted !== true && options.abandon?.aborted !== true; cell = queue.shift()) {
      thread ??= startWorker(options.workModule, workers);
      callbacks.onStart(cell, worker);
      const result = await Promise.race([runCell(thread, cell, worker, callbacks), abandoned.then(() => undefined)]);
      if (result == null) return;
      if (result.crashed) thread = undefined;
      callbacks.onFinish(cell, worker, result.result);
    }
  };
  try {
    await Promise.all(Array.from({ length: threads }, (_, i) => slot(i + 1)));
  } finally {
    await Promise.all(workers.map((thread) => thread.terminate()));
  }
}

function startWorker(workModule: string, workers: Worker[]): Worker {
  const thread = RUNNING_SOURCES ? new Worker(typescriptEntry(), { eval: true, workerData: { workModule } }) : new Worker(WORKER_ENTRY, { workerData: { workModule } });
  // A thread that dies between cells is replaced when its next cell fails; never crash the sweep over it.
  thread.on('error', () => undefined);
  workers.push(thread);
  return thread;
}

/** Worker threads do not inherit the tsx loader: code that registers it, then loads the TypeScript entry. */
function typescriptEntry(): string {
  const tsx = import.meta.resolve('tsx/esm/api');
  return `import(${JSON.stringify(tsx)}).then((api) => { api.register(); return import(${JSON.stringify(WORKER_ENTRY.href)}); });`;
}

function runCell(thread: Worker, cell: PlannedCell, worker: number, callbacks: PoolCallbacks): Promise<{ result: CellResult; crashed: boolean }> {
  const started = performance.now();
  const log: EpochLog[] = [];
  const seconds = () => (performance.now() - started) / 1000;
  return new Promise((resolve) => {
    const finish = (result: CellResult, crashed: boolean) => {
      thread.off('message', onMessage).off('error', onError).off('exit', onExit);
      resolve({ result, crashed });
    };
    const onMessage = (message: WorkerMessage) => {
      if (message.type === 'epoch') {
        log.push(message.log);
        callbacks.onEpoch(cell, worker, message.log);
      } else if (message.type === 'done') {
        finish({ status: 'done', outcome: message.outcome, totalSeconds: seconds() }, false);
      } else {
        finish({ status: 'failed', reason: message.reason, log, totalSeconds: seconds() }, false);
      }
    };
    const onError = (error: Error) => finish({ status: 'failed', reason: `worker crashed: ${error.message}`, log, totalSeconds: seconds() }, true);
    const onExit = (code: number) => finish({ status: 'failed', reason: `worker exited with code ${code}`, log, totalSeconds: seconds() }, true);
    thread.on('message', onMessage).on('error', onError).on('exit', onExit);
    thread.postMessage(cell);
  });
}
