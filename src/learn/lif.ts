import type { ResetName, SpikingEncoderSpec, SurrogateName } from './spec.js';
import type { SurrogateDerivative } from './surrogates.js';

// Leaky integrate-and-fire units in discrete time (Gerstner et al. 2014, Neuronal Dynamics,
// §1.3): τ·dV/dt = −V + R·I(t), a spike when V reaches the threshold θ, then a reset. With
// the current held constant over a step of length Δt the membrane equation integrates
// exactly to
//     U[t] = β·V[t−1] + (1 − β)·I[t],   β = exp(−Δt/τ),
// where I stands for R·I, in the membrane potential's units (a constant I settles at V = I,
// so I = θ is the rheobase). Then S[t] = H(U[t] − θ) and V[t] = U[t] − θ·S[t] (reset by
// subtraction) or U[t]·(1 − S[t]) (reset to zero). For `refractorySteps` steps after a spike
// the membrane is held at 0 and the unit cannot fire. Arrays are time-major: row t·batch + b
// of a [steps·batch, units] matrix is sample b at step t.

/** The dynamics of one spiking layer, in the units of the discrete model above. */
export interface LifParameters {
  /** Time steps T per sample. */
  readonly steps: number;
  /** Membrane decay per step, exp(−Δt/τ); 1 is a perfect integrator. */
  readonly beta: number;
  /** Weight of a step's input current, 1 − β for the exact integration of a step-constant current. */
  readonly gain: number;
  readonly threshold: number;
  readonly reset: ResetName;
  /** Steps after a spike during which the membrane is held at 0. */
  readonly refractorySteps: number;
}

/** The surrogate derivative a layer's backward pass uses. */
export interface SurrogateSetting {
  readonly name: SurrogateName;
  readonly slope: number;
}

/** The discrete-time parameters of a spiking encoder's settings. */
export function lifParameters(spec: SpikingEncoderSpec): LifParameters {
  const beta = Math.exp(-spec.dtMs / spec.tauMs);
  return {
    steps: spec.steps,
    beta,
    gain: 1 - beta,
    threshold: spec.threshold,
    reset: spec.reset,
    refractorySteps: Math.round(spec.refractoryMs / spec.dtMs),
  };
}

/** What one layer's simulation leaves for the backward pass and the layer above. */
export interface LifArrays {
  /** S[t], 0 or 1. [steps·batch, units] */
  readonly spikes: Float32Array;
  /** ∂U[t]/∂I[t]·σ′(U[t] − θ): gain × the surrogate, 0 while refractory. [steps·batch, units] */
  readonly surrogate: Float32Array;
  /** ∂V[t]/∂U[t] with the reset held fixed: 1, or 1 − S[t] for reset to zero; 0 while refractory. [steps·batch, units] */
  readonly carry: Float32Array;
  /** Spike count over the steps ÷ steps. [batch, units] */
  readonly rate: Float32Array;
}

/**
 * Simulates one layer for `p.steps` steps from rest. `current` holds I for every step
 * ([steps·batch, units]) or one row per sample held over every step ([batch, units]).
 */
export function lifForward(current: Float32Array, batch: number, units: number, p: LifParameters, surrogate: SurrogateDerivative, slope: number, out: LifArrays): void {
  const n = batch * units;
  const held = current.length === n;
  const V = new Float32Array(n);
  const refractory = new Int32Array(n);
  const { beta, gain, threshold, steps, refractorySteps } = p;
  const zero = p.reset === 'zero' ? 1 : 0; // arithmetic instead of a branch per element
  const { spikes, carry, rate } = out;
  // distance[i] = U[t] − θ, NaN while refractory; turned into the surrogate afterwards.
  const distance = out.surrogate;
  rate.fill(0);
  for (let t = 0; t < steps; t++) {
    const base = t * n;
    const from = held ? 0 : base;
    for (let k = 0; k < n; k++) {
      const i = base + k;
      if (refractory[k] > 0) {
        refractory[k] -= 1;
        V[k] = 0;
        spikes[i] = 0;
        distance[i] = Number.NaN;
        carry[i] = 0;
        continue;
      }
      const u = Math.fround(beta * V[k] + gain * current[from + k]);
      const d = u - threshold;
      const s = d >= 0 ? 1 : 0;
      spikes[i] = s;
      distance[i] = d;
      carry[i] = 1 - zero * s;
      V[k] = u - s * (zero * u + (1 - zero) * threshold); // U − θ·S, or U·(1 − S)
      rate[k] += s;
      refractory[k] = s * refractorySteps;
    }
  }
  for (let k = 0; k < n; k++) rate[k] /= steps;
  for (let i = 0; i < distance.length; i++) {
    const d = distance[i];
    distance[i] = d === d ? gain * surrogate(d, slope) : 0; // NaN (refractory) fails d === d
  }
}

/**
 * Backpropagation through time of one layer (Werbos 1990) with the surrogate in place of the
 * spike's derivative and the reset held fixed (detached, as Zenke & Vogels 2021, Neural
 * Comput. 33:899, recommend; from memory): from the signal g[t] = ∂L/∂S[t],
 *     ε[t] = ∂L/∂I[t] = surrogate[t]·g[t] + carry[t]·β·ε[t + 1],   ε[T] = 0.
 * `signal` is per step ([steps·batch, units]) or ∂L/∂rate ([batch, units]), which sends
 * ∂L/∂rate ÷ steps to every step. `out` receives ε ([steps·batch, units]) or, with
 * `sumOverTime`, Σ_t ε[t] ([batch, units]) for a layer whose input is held over the steps.
 */
export function lifBackward(
  signal: Float32Array, surrogate: Float32Array, carry: Float32Array, batch: number, units: number,
  p: Pick<LifParameters, 'steps' | 'beta'>, sumOverTime: boolean, out: Float32Array,
): void {
  const n = batch * units;
  const perRate = signal.length === n;
  const scale = perRate ? 1 / p.steps : 1;
  const next = new Float32Array(n);
  if (sumOverTime) out.fill(0);
  for (let t = p.steps - 1; t >= 0; t--) {
    const base = t * n;
    const from = perRate ? 0 : base;
    for (let k = 0; k < n; k++) {
      const i = base + k;
      const e = surrogate[i] * signal[from + k] * scale + carry[i] * p.beta * next[k];
      next[k] = e;
      if (sumOverTime) out[k] += e;
      else out[i] = e;
    }
  }
}
