import { normal, type Rng } from '../random.js';
import type { ActivationName } from './spec.js';

/**
 * Glorot uniform weights, U(−a, a) with a = √(6 / (fanIn + fanOut)) (Glorot & Bengio 2010,
 * eq. 16). [fanIn, fanOut] row-major.
 */
export function glorotUniform(rng: Rng, fanIn: number, fanOut: number): Float32Array {
  const a = Math.sqrt(6 / (fanIn + fanOut));
  return Float32Array.from({ length: fanIn * fanOut }, () => (2 * rng() - 1) * a);
}

/** He normal weights, N(0, 2 / fanIn), for ReLU layers (He et al. 2015, eq. 10). [fanIn, fanOut] */
export function heNormal(rng: Rng, fanIn: number, fanOut: number): Float32Array {
  const sd = Math.sqrt(2 / fanIn);
  return Float32Array.from({ length: fanIn * fanOut }, () => normal(rng) * sd);
}

/** The initialiser suited to a hidden layer's activation. */
export function hiddenInit(activation: ActivationName): (rng: Rng, fanIn: number, fanOut: number) => Float32Array {
  return activation === 'relu' ? heNormal : glorotUniform;
}

/**
 * Spiking layers: He-normal weights scaled by 1/r₀ where a layer reads spikes, so that its mean
 * input current has the spread He et al. give a ReLU layer when its inputs fire at r₀ spikes
 * per step; a layer that reads the standardised input held as a current starts He-normal.
 */
export function spikingInit(heldInput: (layer: number) => boolean, inputRate = SPIKING_INPUT_RATE): (rng: Rng, fanIn: number, fanOut: number, layer: number) => Float32Array {
  return (rng, fanIn, fanOut, layer) => {
    const w = heNormal(rng, fanIn, fanOut);
    if (heldInput(layer)) return w;
    return w.map((v) => v / inputRate);
  };
}

/** The firing rate, spikes per step, that spiking layers' initial weights assume of their inputs (common practice: tuned on the demo worlds). */
export const SPIKING_INPUT_RATE = 0.2;
