import { createHash } from 'node:crypto';
import { createRng, type Rng } from '../random.js';

/** Probability of a spike per time step for a standardised input value: the logistic 1 / (1 + e^−x). */
export function spikeProbability(x: number): number {
  return 1 / (1 + Math.exp(-x));
}

/**
 * Rate coding: Bernoulli spike trains of standardised rows x ([rows, cols]), each entry
 * spiking at each of `steps` steps with probability spikeProbability(x). Returns
 * [steps·rows, cols], time-major (row t·rows + r is row r at step t). Row r's draws come
 * from `rngOfRow(r)`, step by step, column by column.
 */
export function poissonSpikes(x: Float32Array, rows: number, cols: number, steps: number, rngOfRow: (row: number) => Rng): Float32Array {
  const out = new Float32Array(steps * rows * cols);
  const p = Float64Array.from(x, spikeProbability);
  for (let r = 0; r < rows; r++) {
    const rng = rngOfRow(r);
    for (let t = 0; t < steps; t++) {
      const to = (t * rows + r) * cols;
      for (let i = 0; i < cols; i++) out[to + i] = rng() < p[r * cols + i] ? 1 : 0;
    }
  }
  return out;
}

/**
 * The generator of a row's spikes when the spikes must be a function of the row alone
 * (validation, features): keyed by the seed and the row's bytes, so equal rows get equal
 * spike trains in any order, chunk or process. Stream `spikes/row/<first 16 hex digits of
 * the SHA-256 of the row's float32 bytes>`.
 */
export function rowStream(seed: number, x: Float32Array, cols: number): (row: number) => Rng {
  return (row) => {
    const bytes = new Uint8Array(x.buffer, x.byteOffset + row * cols * 4, cols * 4);
    return createRng(seed, 'spikes', 'row', createHash('sha256').update(bytes).digest('hex').slice(0, 16));
  };
}
