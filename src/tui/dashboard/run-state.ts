import type { CellLabel, RunEvent } from '../../experiment/events.js';
import type { LayerFiring } from '../../learn/spec.js';
import { isScore, type Measurement } from '../../results/results-table.js';

/** What one worker is doing right now. */
export interface WorkerActivity {
  readonly worker: number;
  readonly cell: CellLabel;
  readonly startedMs: number;
  readonly epoch: number | null;
  /** Training loss per finished epoch, oldest first. */
  readonly losses: readonly number[];
  /** A spiking learner's activity per hidden layer at its latest epoch; null for rate encoders and before the first epoch. */
  readonly firing: LayerFiring | null;
}

/** Probe scores collected so far for one learner row, one table of the dashboard. */
export interface ScoreSeries {
  /** Row label: the learner, with the cell's vary values when there are any. */
  readonly row: string;
  readonly view: string;
  readonly noise: string;
  readonly severity: number;
  /** One value per seed, in arrival order. */
  readonly values: readonly number[];
}

/** Everything the run dashboard knows, folded from the event stream. */
export interface RunState {
  readonly name: string;
  /** The output folder, once the sweep has started. */
  readonly out: string | null;
  readonly total: number;
  readonly skipped: number;
  readonly jobs: number;
  readonly startedMs: number;
  readonly done: number;
  readonly failed: number;
  readonly workers: readonly WorkerActivity[];
  /** Wall-clock seconds of each finished cell. */
  readonly cellSeconds: readonly number[];
  readonly lastFailure: string | null;
  /** `target (metric)` views in order of first appearance. */
  readonly views: readonly string[];
  /** `channel kind` noise conditions in order of first appearance. */
  readonly noises: readonly string[];
  readonly scores: readonly ScoreSeries[];
  readonly finished: { readonly seconds: number; readonly interrupted: boolean; readonly summary: string } | null;
}

/** The state before any event, for a sweep of `total` cells named `name`. */
export function initialRunState(name: string, total: number, nowMs: number): RunState {
  return {
    name, out: null, total, skipped: 0, jobs: 1, startedMs: nowMs, done: 0, failed: 0, workers: [],
    cellSeconds: [], lastFailure: null, views: [], noises: [], scores: [], finished: null,
  };
}

/** Folds one run event into the state; `nowMs` stamps cell starts for the ETA. */
export function reduceRun(state: RunState, event: RunEvent, nowMs: number): RunState {
  switch (event.type) {
    case 'sweep-start':
      return { ...state, name: event.name, out: event.out, total: event.total, skipped: event.skipped, jobs: Math.max(1, event.jobs), startedMs: nowMs };
    case 'cell-start':
      return { ...state, workers: withWorker(state.workers, { worker: event.worker, cell: event.cell, startedMs: nowMs, epoch: null, losses: [], firing: null }) };
    case 'epoch':
      return { ...state, workers: state.workers.map((w) => (w.worker === event.worker && w.cell.id === event.cell.id
        ? { ...w, epoch: event.log.epoch, losses: [...w.losses, event.log.trainLoss], firing: event.log.firing ?? null }
        : w)) };
    case 'cell-done':
      return {
        ...addScores(state, rowLabel(event.cell), event.scores),
        done: state.done + 1,
        workers: withoutCell(state.workers, event.cell.id),
        cellSeconds: [...state.cellSeconds, event.seconds],
      };
    case 'cell-failed':
      return {
        ...state,
        failed: state.failed + 1,
        workers: withoutCell(state.workers, event.cell.id),
        lastFailure: `${event.cell.learner} seed ${event.cell.seed} [${event.cell.id}]: ${event.reason}`,
      };
    case 'sweep-done':
      return { ...state, workers: [], finished: { seconds: event.seconds, interrupted: event.interrupted, summary: event.summary } };
  }
}

function withWorker(workers: readonly WorkerActivity[], next: WorkerActivity): WorkerActivity[] {
  return [...workers.filter((w) => w.worker !== next.worker), next].sort((a, b) => a.worker - b.worker);
}

function withoutCell(workers: readonly WorkerActivity[], cellId: string): WorkerActivity[] {
  return workers.filter((w) => w.cell.id !== cellId);
}

/** A cell's row label: its learner, plus its vary values so differing settings get their own rows. */
export function rowLabel(cell: CellLabel): string {
  const vary = Object.entries(cell.vary).map(([key, value]) => `${key.split('.').pop()}=${value}`);
  return vary.length === 0 ? cell.learner : `${cell.learner} ${vary.join(' ')}`;
}

/** The view name a score belongs to: its target and metric. */
export function viewOf(score: Measurement): string {
  return `${score.target} (${score.metric})`;
}

/** The noise condition a score belongs to. */
export function noiseOf(score: Measurement): string {
  return `${score.channel} ${score.kind}`;
}

function addScores(state: RunState, row: string, measurements: readonly Measurement[]): RunState {
  let { views, noises } = state;
  const series = [...state.scores];
  for (const score of measurements.filter(isScore)) {
    const view = viewOf(score);
    const noise = noiseOf(score);
    if (!views.includes(view)) views = [...views, view];
    if (!noises.includes(noise)) noises = [...noises, noise];
    const i = series.findIndex((s) => s.row === row && s.view === view && s.noise === noise && s.severity === score.severity);
    if (i < 0) series.push({ row, view, noise, severity: score.severity, values: [score.value] });
    else series[i] = { ...series[i], values: [...series[i].values, score.value] };
  }
  return { ...state, views, noises, scores: series };
}
