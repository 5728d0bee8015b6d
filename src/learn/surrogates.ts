import type { SurrogateName } from './spec.js';

/**
 * A surrogate derivative σ′(u) of the spike H(u), u = membrane potential − threshold, used in
 * the backward pass while the forward pass keeps the hard threshold. Each peaks at σ′(0) = 1,
 * and the two smooth ones integrate to 2/k, so one slope k means the same width for both.
 */
export type SurrogateDerivative = (u: number, slope: number) => number;

/** Every surrogate by its config name (the names are SURROGATES in spec.ts). */
export const SURROGATE_REGISTRY: Record<SurrogateName, SurrogateDerivative> = {
  // SuperSpike's fast sigmoid (Zenke & Ganguli 2018, Neural Comput. 30:1514):
  // σ′(u) = 1 / (1 + k|u|)², the derivative of u / (1 + k|u|).
  'fast-sigmoid': (u, k) => 1 / (1 + k * Math.abs(u)) ** 2,
  // The arctan surrogate (Fang et al. 2021, ICCV; theirs is (1/π)·arctan(πku/2) + 1/2,
  // peaking at k/2), scaled to peak at 1: σ′(u) = 1 / (1 + (πku/2)²), the derivative of (2/(πk))·arctan(πku/2).
  arctan: (u, k) => 1 / (1 + ((Math.PI * k * u) / 2) ** 2),
  // The straight-through estimator (Bengio et al. 2013, arXiv:1308.3432): the step's
  // derivative is taken as 1 everywhere; the slope is unused.
  'straight-through': () => 1,
};

/** The numeric code of each surrogate, as the host kernels take it (attributes are numbers). */
export const SURROGATE_CODES: Record<SurrogateName, number> = { 'fast-sigmoid': 0, arctan: 1, 'straight-through': 2 };

/** The surrogate with a given numeric code. */
export function surrogateOfCode(code: number): SurrogateDerivative {
  const name = (Object.keys(SURROGATE_CODES) as SurrogateName[]).find((n) => SURROGATE_CODES[n] === code);
  if (name == null) throw new Error(`unknown surrogate code ${code}`);
  return SURROGATE_REGISTRY[name];
}
