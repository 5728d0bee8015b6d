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
