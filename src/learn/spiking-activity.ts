import * as tf from '@tensorflow/tfjs-core';
import { columnSums } from './dense-kernels.js';
import type { Tower } from './network.js';
import { simulate, type SpikingDynamics } from './spiking-network.js';
import type { LayerFiring } from './spec.js';

/** Samples simulated at once when measuring activity, to bound memory. */
const CHUNK = 1024;

/**
 * Firing of each hidden layer of a spiking tower over `n` samples: the mean rate over units,
 * samples and steps in Hz, and the fraction of units that never spiked. `input(start, end)`
 * gives the tower input of samples start..end − 1 (called inside tf.tidy).
 */
export function layerFiring(tower: Tower, n: number, input: (start: number, end: number) => tf.Tensor2D, d: SpikingDynamics): LayerFiring {
  const totals = tower.encoder.map((layer) => new Float64Array((layer.W as tf.Tensor2D).shape[1]));
  for (let start = 0; start < n; start += CHUNK) {
    const end = Math.min(start + CHUNK, n);
    const sums = tf.tidy(() => tf.concat(simulate(tower, input(start, end), d).layers.map((l) => columnSums(l.rate))).dataSync());
    let offset = 0;
    for (const total of totals) {
      for (let j = 0; j < total.length; j++) total[j] += sums[offset + j];
      offset += total.length;
    }
  }
  const perSecond = 1000 / d.dtMs;
  return {
    rateHz: totals.map((total) => (total.reduce((a, b) => a + b, 0) / (total.length * n)) * perSecond),
    silentFraction: totals.map((total) => total.filter((v) => v === 0).length / total.length),
  };
}
