import { existsSync, mkdirSync } from 'node:fs';
import { writeFileAtomic } from '../results/atomic-file.js';
import { moveCellAside, removeLeftovers } from '../results/cell-folder.js';
import { cellIdentity } from '../results/cell-identity.js';
import type { CellRecord } from '../results/cell-record.js';
import { outputPath, pluginBundlePath } from '../results/layout.js';
import { formatPlanCsv } from '../results/plan-table.js';
import { cellFaultLine, inspectStoredCell } from '../results/stored-cell.js';
import { readStoredRun, writeResultsCsv } from '../results/stored-results.js';
import { writeFailure } from '../results/write-failure.js';
import type { RunEvent, RunListener } from './events.js';
import { cellLabel, cellSettings, planCells, planTable, type PlannedCell } from './plan.js';
import { lockOutput } from './output-lock.js';
import { claimOutput } from './ownership.js';
import { runOnPool } from './pool.js';
import type { Sweep } from './resolved-config.js';
import { resolvedConfigYaml } from './resolved-yaml.js';
import { storeCell, type CellResult } from './store.js';

/** How to run a sweep. */
export interface RunOptions {
  readonly jobs: number;
  /** URL of the module exporting `cellWork` (PIPELINE_MODULE in production). */
  readonly workModule: string;
  readonly listeners: readonly RunListener[];
  /** Aborting stops the sweep gently: no cell starts any more, running cells finish and are stored. */
  readonly signal?: AbortSignal;
  /** Aborting stops the sweep at once: running cells are abandoned unwritten; finished ones stay. */
  readonly abandon?: AbortSignal;
  /** Builds the report from the stored results and returns a line saying where its summary is; rejects when it cannot. */
  readonly report?: (out: string) => Promise<string>;
  /** Told one line about each thing the run works around (a damaged cell moved aside and recomputed). */
  readonly warn?: (line: string) => void;
  /** Compute failed cells again instead of skipping them. */
  readonly retryFailed?: boolean;
  /** Take over an output folder that belongs to another experiment or results format (claimOutput), or another machine's lock (lockOutput). */
  readonly force?: boolean;
}

/** How a sweep ended. */
export interface SweepOutcome {
  readonly done: number;
  readonly failed: number;
  readonly interrupted: boolean;
  /** One line per write that failed (a cell, results.csv, the report): each names what and the OS error. */
  readonly writeFailures: readonly string[];
}

/**
 * Runs every unfinished cell of a sweep and stores each as it finishes, then rebuilds
 * results.csv from the stored cells (in config order) and the report. Finished cells
 * (done, and failed unless `retryFailed`) are skipped, so rerunning after an
 * interruption completes the sweep.
 * A cell that cannot be stored (a full disk, a folder made unwritable) fails with one
 * line naming it and the file; running cells finish, but no new cell starts. The output
 * folder is locked for the whole run (lockOutput).
 */
export async function runSweep(sweep: Sweep, options: RunOptions): Promise<SweepOutcome> {
  const warn = options.warn ?? (() => undefined);
  const release = lockOutput(sweep.out, options.force === true, warn);
  try {
    return await runLocked(sweep, options, warn);
  } finally {
    release();
  }
}

async function runLocked(sweep: Sweep, options: RunOptions, warn: (line: string) => void): Promise<SweepOutcome> {
  const started = performance.now();
  const emit = (event: RunEvent) => options.listeners.forEach((listener) => listener(event));
  const cells = prepareOutput(sweep, options.force === true, warn);
  const stored = storedCells(sweep.out, cells, warn);
  const retried = new Set(options.retryFailed === true ? [...stored.values()].filter((r) => r.status === 'failed').map((r) => r.id) : []);
  for (const id of retried) stored.delete(id);
  const pending = cells.filter((cell) => !stored.has(cell.id));
  emit({ type: 'sweep-start', name: sweep.name, out: sweep.out, total: cells.length, skipped: cells.length - pending.length, jobs: options.jobs });
  const phases = { collect: 0, train: 0, probe: 0 };
  const writeFailures: string[] = [];
  const stopStarting = new AbortController();
  const signal = options.signal == null ? stopStarting.signal : AbortSignal.any([options.signal, stopStarting.signal]);
  await runOnPool(pending, { ...options, signal }, {
    onStart: (cell, worker) => emit({ type: 'cell-start', cell: cellLabel(cell), worker }),
    onEpoch: (cell, worker, log) => emit({ type: 'epoch', cell: cellLabel(cell), worker, log }),
    onFinish: (cell, worker, result) => {
      if (options.abandon?.aborted === true) return;
      const failure = attemptWrite(() => stored.set(cell.id, storeCell(sweep.out, cell, result, sweep.varyKeys, retried.has(cell.id))));
      if (failure != null) {
        writeFailures.push(`cell ${cell.index} (${cell.id}): ${failure}`);
        stopStarting.abort();
        emit({ type: 'cell-failed', cell: cellLabel(cell), worker, reason: `not stored: ${failure}` });
        return;
      }
      if (result.status === 'done') for (const phase of ['collect', 'train', 'probe'] as const) phases[phase] += result.outcome.seconds[phase];
      emit(cellEndEvent(cell, worker, result));
    },
  });
  const interrupted = options.signal?.aborted === true || options.abandon?.aborted === true;
  const { done, failed } = countCells(stored);
  const { results: rows } = readStoredRun(sweep.out, planTable(cells, sweep.varyKeys), (id, fault) => warn(cellFaultLine(id, fault, 'left out of results.csv (run again to recompute it)')));
  let where = `results: ${outputPath(sweep.out, 'results')}`;
  const resultsFailure = attemptWrite(() => writeResultsCsv(sweep.out, rows));
  if (resultsFailure != null) writeFailures.push(`results.csv: ${resultsFailure}`);
  const reportStarted = performance.now();
  if (!interrupted && resultsFailure == null && done > 0 && options.report != null) {
    const report = await options.report(sweep.out).catch((error: unknown) => error as Error);
    const failed = report instanceof Error ? writeFailure(report) : null;
    if (failed != null) writeFailures.push(`the report could not be written: ${failed}`);
    else if (report instanceof Error) {
      where = `the report could not be built: ${report.message}`;
      warn(where);
    } else where = report;
  }
  const reportSeconds = (performance.now() - reportStarted) / 1000;
  const summary = `${where}; time in cells run now: collect ${phases.collect.toFixed(1)} s, train ${phases.train.toFixed(1)} s, probe ${phases.probe.toFixed(1)} s (summed over workers); report ${reportSeconds.toFixed(1)} s`;
  emit({ type: 'sweep-done', done, failed, seconds: (performance.now() - started) / 1000, summary, interrupted });
  return { done, failed, interrupted, writeFailures };
}

/** Runs a write; returns null when it worked, else one line saying what could not be written and why. */
function attemptWrite(write: () => unknown): string | null {
  try {
    write();
    return null;
  } catch (error) {
    return writeFailure(error) ?? (error as Error).message;
  }
}

/** The `cell-done` or `cell-failed` event that reports a cell's result. */
export function cellEndEvent(cell: PlannedCell, worker: number, result: CellResult): RunEvent {
  return result.status === 'done'
    ? { type: 'cell-done', cell: cellLabel(cell), worker, seconds: result.totalSeconds, scores: result.outcome.rows }
    : { type: 'cell-failed', cell: cellLabel(cell), worker, reason: result.reason };
}

/**
 * Claims the output folder for the sweep's experiment (claimOutput: an OutputBusyError,
 * and nothing written, when it belongs to another), creates it, writes
 * config.resolved.yaml, plan.csv and the bundled script of each plug-in (kept: a script's
 * name holds its hash), clears leftovers of killed runs; returns the plan.
 */
export function prepareOutput(sweep: Sweep, force: boolean, warn: (line: string) => void): PlannedCell[] {
  const cells = planCells(sweep);
  claimOutput(sweep.out, cells, sweep.varyKeys, force, warn);
  mkdirSync(outputPath(sweep.out, 'cells'), { recursive: true });
  for (const plugin of sweep.plugins) {
    const bundle = pluginBundlePath(sweep.out, plugin.name, plugin.sha256);
    if (!existsSync(bundle)) writeFileAtomic(bundle, plugin.code);
  }
  writeFileAtomic(outputPath(sweep.out, 'config'), resolvedConfigYaml(sweep));
  writeFileAtomic(outputPath(sweep.out, 'plan'), formatPlanCsv(planTable(cells, sweep.varyKeys)));
  removeLeftovers(sweep.out);
  return cells;
}

/**
 * The records of the cells already stored and trusted. A damaged cell (see
 * inspectStoredCell) is moved aside, never deleted, with one warning line, and is then
 * computed again like a cell never run.
 */
export function storedCells(out: string, cells: readonly PlannedCell[], warn: (line: string) => void): Map<string, CellRecord> {
  const records = new Map<string, CellRecord>();
  for (const cell of cells) {
    const stored = inspectStoredCell(out, cell.id, cellIdentity(cellSettings(cell)));
    if (stored.state === 'trusted') records.set(cell.id, stored.record);
    if (stored.state === 'damaged') warn(cellFaultLine(cell.id, stored.fault, `moved to cells/${moveCellAside(out, cell.id)}, recomputing`));
  }
  return records;
}

function countCells(stored: ReadonlyMap<string, CellRecord>): { done: number; failed: number } {
  const statuses = [...stored.values()].map((record) => record.status);
  return { done: statuses.filter((s) => s === 'done').length, failed: statuses.filter((s) => s === 'failed').length };
}
