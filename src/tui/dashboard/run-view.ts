import { formatDuration, formatFixed, formatMeanCi } from '../format.js';
import { sparkline } from '../sparkline.js';
import type { LayerFiring } from '../../learn/spec.js';
import type { RunState, ScoreSeries } from './run-state.js';

/** A mean and, once there are at least two values, its 95% confidence half-width. */
export interface ScoreSummary {
  readonly mean: number;
  readonly halfWidth: number | null;
}

/** Summarises one learner's values at one severity (supplied by the statistics module). */
export type Summarise = (values: readonly number[]) => ScoreSummary;

/** The progress header's lines, already formatted. */
export interface ProgressText {
  readonly title: string;
  readonly counts: string;
  readonly timing: string;
  /** How the sweep ended or is stopping, and the latest failure; empty while all is well. */
  readonly notes: readonly string[];
}

/** One running worker's line, already formatted. */
export interface WorkerText {
  readonly worker: string;
  readonly cell: string;
  readonly epoch: string;
  readonly loss: string;
  readonly trend: string;
  /** A spiking learner's firing per hidden layer, first layer first; empty for rate encoders. */
  readonly firing: string;
}

/** The results table, already formatted. */
export interface TableText {
  readonly caption: string;
  readonly columns: readonly string[];
  readonly rows: readonly { readonly label: string; readonly cells: readonly string[] }[];
}

const SPARK_WIDTH = 10;

/** Cells still waiting for a worker. */
export function queuedCells(state: RunState): number {
  return Math.max(0, state.total - state.skipped - state.done - state.failed - state.workers.length);
}

/**
 * Seconds until the sweep ends, assuming each remaining cell takes the mean measured
 * cell time and `jobs` workers share them; null until one cell has finished.
 */
export function etaSeconds(state: RunState, nowMs: number): number | null {
  if (state.cellSeconds.length === 0) return null;
  const mean = state.cellSeconds.reduce((a, b) => a + b, 0) / state.cellSeconds.length;
  const runningLeft = state.workers.reduce((sum, w) => sum + Math.max(0, mean - (nowMs - w.startedMs) / 1000), 0);
  return (queuedCells(state) * mean + runningLeft) / state.jobs;
}

/** The progress header for the state at time `nowMs`. */
export function progressText(state: RunState, nowMs: number, stopping: boolean): ProgressText {
  const earlier = state.skipped > 0 ? ` (${state.skipped} stored earlier)` : '';
  const counts = `cells ${state.done + state.skipped}/${state.total} done${earlier} · ${state.failed} failed · `
    + `${state.workers.length} running · ${queuedCells(state)} queued`;
  const workers = `${state.jobs} worker${state.jobs === 1 ? '' : 's'}`;
  const timing = state.finished == null
    ? `elapsed ${formatDuration(Math.max(0, nowMs - state.startedMs) / 1000)} · eta ${formatDuration(etaSeconds(state, nowMs))} · ${workers}`
    : `took ${formatDuration(state.finished.seconds)} · ${workers}`;
  const title = `crosswise run · ${state.name}${state.out == null ? '' : ` · writing to ${state.out}`}`;
  return { title, counts, timing, notes: notes(state, stopping) };
}

function notes(state: RunState, stopping: boolean): string[] {
  const ending = state.finished == null
    ? (stopping ? ['stopping: letting running cells finish'] : [])
    : [`${state.finished.interrupted ? 'stopped' : 'finished'}: ${state.finished.summary}`];
  return state.lastFailure == null ? ending : [...ending, `last failure: ${state.lastFailure}`];
}

/** One line per running worker, in worker order. */
export function workerTexts(state: RunState): WorkerText[] {
  return state.workers.map((w) => ({
    worker: `worker ${w.worker}`,
    cell: `${w.cell.learner} seed ${w.cell.seed} [${w.cell.id}]`,
    epoch: w.epoch == null ? 'starting' : `epoch ${w.epoch}`,
    loss: w.losses.length === 0 ? '' : `loss ${formatFixed(w.losses[w.losses.length - 1], 4)}`,
    trend: sparkline(w.losses, SPARK_WIDTH),
    firing: w.firing == null ? '' : firingText(w.firing),
  }));
}

/** `firing 152 · 98 Hz · silent 0% · 6%`: rates and silent fractions of each hidden layer. */
function firingText(firing: LayerFiring): string {
  const rates = firing.rateHz.map((r) => formatFixed(r, 0)).join(' · ');
  const silent = firing.silentFraction.map((f) => `${formatFixed(100 * f, 0)}%`).join(' · ');
  return `firing ${rates} Hz · silent ${silent}`;
}

/** The table of one view (target and metric) under one noise condition: a row per learner, a column per severity. */
export function tableText(state: RunState, view: string, noise: string, summarise: Summarise): TableText {
  const shown = state.scores.filter((s) => s.view === view && s.noise === noise);
  const severities = [...new Set(shown.map((s) => s.severity))].sort((a, b) => a - b);
  const rows = [...new Set(shown.map((s) => s.row))].map((label) => ({
    label,
    cells: severities.map((severity) => cellText(shown.find((s) => s.row === label && s.severity === severity), summarise)),
  }));
  const seeds = Math.max(0, ...shown.map((s) => s.values.length));
  const caption = `${view} · ${noise} noise · mean ± 95% CI · ${seeds} seed${seeds === 1 ? '' : 's'}`;
  return { caption, columns: severities.map((s) => `sev ${s}`), rows };
}

function cellText(series: ScoreSeries | undefined, summarise: Summarise): string {
  if (series == null) return '';
  const { mean, halfWidth } = summarise(series.values);
  return formatMeanCi(mean, series.values.length >= 2 ? halfWidth : null);
}
