import * as tf from '@tensorflow/tfjs-core';
import { registerHostKernel, runHostKernel, type HostAttrs, type HostKernel } from './host-kernels.js';
import { lifBackward, lifForward, type LifParameters, type SurrogateSetting } from './lif.js';
import { SURROGATE_CODES, surrogateOfCode } from './surrogates.js';

// A spiking layer's simulation over every time step as one host kernel each way: the
// recurrence in time is elementwise, so a per-step tfjs loop would cost T × several kernel
// dispatches per layer for a few multiply-adds each.

const RESET_CODES = { subtract: 0, zero: 1 } as const;

/** The numeric attributes the LIF kernels take. */
function lifAttrs(p: LifParameters, surrogate: SurrogateSetting, batch: number): HostAttrs {
  return {
    steps: p.steps, beta: p.beta, gain: p.gain, threshold: p.threshold, reset: RESET_CODES[p.reset],
    refractorySteps: p.refractorySteps, surrogate: SURROGATE_CODES[surrogate.name], slope: surrogate.slope, batch,
  };
}

function parametersOf(attrs: HostAttrs): LifParameters {
  return {
    steps: attrs.steps, beta: attrs.beta, gain: attrs.gain, threshold: attrs.threshold,
    reset: attrs.reset === RESET_CODES.zero ? 'zero' : 'subtract', refractorySteps: attrs.refractorySteps,
  };
}

const LIF_FORWARD: HostKernel = {
  name: 'CrosswiseLifForward',
  // current [rows, units] → spikes, surrogate, carry [steps·batch, units]; rate [batch, units]
  outputShapes: ([[, units]], { steps, batch }) => [[steps * batch, units], [steps * batch, units], [steps * batch, units], [batch, units]],
  run: ([current], [spikes, surrogate, carry, rate], attrs) => {
    const units = rate.length / attrs.batch;
    lifForward(current, attrs.batch, units, parametersOf(attrs), surrogateOfCode(attrs.surrogate), attrs.slope, { spikes, surrogate, carry, rate });
  },
};

const LIF_BACKWARD: HostKernel = {
  name: 'CrosswiseLifBackward',
  // signal, surrogate, carry → ε [steps·batch, units], or Σ_t ε [batch, units]
  outputShapes: ([, [rows, units]], { steps, sumOverTime }) => [[sumOverTime === 1 ? rows / steps : rows, units]],
  run: ([signal, surrogate, carry], [out], attrs) => {
    const units = out.length / (attrs.sumOverTime === 1 ? attrs.batch : attrs.steps * attrs.batch);
    lifBackward(signal, surrogate, carry, attrs.batch, units, { steps: attrs.steps, beta: attrs.beta }, attrs.sumOverTime === 1, out);
  },
};

/** Registers the LIF kernels on the wasm and cpu backends. */
export function registerSpikingKernels(): void {
  registerHostKernel(LIF_FORWARD);
  registerHostKernel(LIF_BACKWARD);
}

/** One simulated layer as tensors (see LifArrays in lif.ts). */
export interface LifTensors {
  readonly spikes: tf.Tensor2D;
  readonly surrogate: tf.Tensor2D;
  readonly carry: tf.Tensor2D;
  readonly rate: tf.Tensor2D;
}

/** Simulates a layer of `batch` samples from its input current, [steps·batch, units] or held [batch, units]. */
export function lifLayer(current: tf.Tensor2D, batch: number, p: LifParameters, surrogate: SurrogateSetting): LifTensors {
  const [spikes, slope, carry, rate] = runHostKernel(LIF_FORWARD.name, [current], lifAttrs(p, surrogate, batch)) as tf.Tensor2D[];
  return { spikes, surrogate: slope, carry, rate };
}

/**
 * ∂L/∂I of a simulated layer from ∂L/∂S per step ([steps·batch, units]) or ∂L/∂rate
 * ([batch, units]); summed over the steps ([batch, units]) with `sumOverTime`.
 */
export function lifLayerBackward(signal: tf.Tensor2D, layer: LifTensors, batch: number, p: LifParameters, sumOverTime: boolean): tf.Tensor2D {
  const attrs = { steps: p.steps, beta: p.beta, batch, sumOverTime: sumOverTime ? 1 : 0 };
  return runHostKernel(LIF_BACKWARD.name, [signal, layer.surrogate, layer.carry], attrs)[0] as tf.Tensor2D;
}
