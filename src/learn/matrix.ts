import type { Dataset } from '../collect/dataset.js';
import { CHANNELS, type ChannelName } from '../senses/channel.js';
import { columnStatistics } from '../stats/columns.js';

/** A dense row-major matrix of float32 values. */
export interface Matrix {
  readonly rows: number;
  readonly cols: number;
  /** [rows, cols] */
  readonly data: Float32Array;
}

/** Per-column mean and standard deviation fitted on training rows. */
export interface Standardiser {
  readonly mean: Float32Array; // [cols]
  readonly std: Float32Array; // [cols]
}

/** Channels in the fixed CHANNELS order, whatever order the spec listed them in. */
export function orderedChannels(channels: readonly ChannelName[]): ChannelName[] {
  return CHANNELS.filter((c) => channels.includes(c));
}

/** Total width of the given channels (each counted once), as gatherChannels lays them out. */
export function channelWidth(sizes: Readonly<Record<ChannelName, number>>, channels: readonly ChannelName[]): number {
  return orderedChannels(channels).reduce((sum, c) => sum + sizes[c], 0);
}

/**
 * Concatenates the given channels (CHANNELS order) for the given rows of channel arrays.
 * Each source array is [rowsInSource, size[c]]; the result is [steps.length, Σ size].
 */
export function gatherChannels(
  sources: Readonly<Partial<Record<ChannelName, Float32Array>>>,
  sizes: Readonly<Record<ChannelName, number>>,
  channels: readonly ChannelName[],
  steps: ArrayLike<number>,
): Matrix {
  const ordered = orderedChannels(channels);
  const cols = channelWidth(sizes, ordered);
  const data = new Float32Array(steps.length * cols);
  let offset = 0;
  for (const c of ordered) {
    const size = sizes[c];
    const source = sources[c];
    if (source == null) throw new Error(`channel '${c}' is missing from the inputs`);
    for (let i = 0; i < steps.length; i++) {
      const from = steps[i] * size;
      data.set(source.subarray(from, from + size), i * cols + offset);
    }
    offset += size;
  }
  return { rows: steps.length, cols, data };
}

/** Channel rows of a dataset at the given steps. */
export function datasetRows(data: Dataset, channels: readonly ChannelName[], steps: ArrayLike<number>): Matrix {
  return gatherChannels(data.channels, data.channelSize, channels, steps);
}

/** Fits column means and population standard deviations; a column with std below 1e-6 gets std 1 and is only centred. */
export function fitStandardiser(m: Matrix): Standardiser {
  const { mean, std } = columnStatistics(m.data, m.cols, { kind: 'unit-below', tolerance: 1e-6 });
  return { mean: Float32Array.from(mean), std: Float32Array.from(std) };
}

/** (x − mean) / std column by column; returns a new matrix. */
export function standardise(m: Matrix, s: Standardiser): Matrix {
  if (s.mean.length !== m.cols) throw new Error(`standardiser has ${s.mean.length} columns, matrix has ${m.cols}`);
  const data = new Float32Array(m.data.length);
  for (let r = 0; r < m.rows; r++) {
    for (let c = 0; c < m.cols; c++) {
      const i = r * m.cols + c;
      data[i] = (m.data[i] - s.mean[c]) / s.std[c];
    }
  }
  return { rows: m.rows, cols: m.cols, data };
}

/** Steps t whose successor t + 1 is in the same episode (real transitions). */
export function withSuccessor(data: Dataset, steps: Int32Array): Int32Array {
  return steps.filter((t) => data.hasNext[t] === 1);
}
