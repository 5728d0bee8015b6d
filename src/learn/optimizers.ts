import * as tf from '@tensorflow/tfjs-core';
import { registerHostKernel, runHostKernel, type HostAttrs, type HostKernel } from './host-kernels.js';
import type { LearnerSpec, OptimizerName } from './spec.js';
import { wasmKernels } from './wasm-module.js';

/** Applies one update per step to every trainable variable. */
export interface Optimizer {
  /** Updates `variables[i]` with `gradients[i]` (same shapes, same order every step). */
  applyGradients(variables: readonly tf.Variable[], gradients: readonly tf.Tensor[]): void;
  dispose(): void;
}

const f32 = Math.fround;

// Float32 constants of Adam's defaults as tfjs writes them (tf.train.adam: β1 = 0.9,
// β2 = 0.999, ε = the backend's float32 epsilon 1e-7).
const BETA1 = 0.9;
const BETA2 = 0.999;
const EPSILON = 1e-7;

/**
 * Adam (Kingma & Ba 2015, Algorithm 1) for `count` variables laid out as
 * [w…, g…, m…, v…] → [w′…, m′…, v′…]. Every operation is rounded to float32 in the order
 * tfjs's AdamOptimizer applies them, so the weights are bit-identical to tf.train.adam's:
 * m′ = β1·m + (1 − β1)·g, v′ = β2·v + (1 − β2)·g², w′ = −lr·(m′/c1) / (√(v′/c2) + ε) + w,
 * with c1 = 1 − β1ᵗ and c2 = 1 − β2ᵗ given as attributes.
 */
export function adamUpdate(inputs: readonly Float32Array[], outputs: Float32Array[], attrs: HostAttrs): void {
  const { count, learningRate, correction1, correction2 } = attrs;
  const [b1, b2, a1, a2, eps, step] = [BETA1, BETA2, 1 - BETA1, 1 - BETA2, EPSILON, -learningRate].map(f32);
  for (let k = 0; k < count; k++) {
    const [w, g, m, v] = [inputs[k], inputs[count + k], inputs[2 * count + k], inputs[3 * count + k]];
    const [wNext, mNext, vNext] = [outputs[k], outputs[count + k], outputs[2 * count + k]];
    for (let i = 0; i < w.length; i++) {
      const gi = g[i];
      const mi = f32(f32(m[i] * b1) + f32(gi * a1));
      const vi = f32(f32(v[i] * b2) + f32(f32(gi * gi) * a2));
      const denominator = f32(f32(Math.sqrt(f32(vi / correction2))) + eps);
      wNext[i] = f32(f32(f32(f32(mi / correction1) / denominator) * step) + w[i]);
      mNext[i] = mi;
      vNext[i] = vi;
    }
  }
}

/** Plain gradient descent for `count` variables, [w…, g…] → [w′…], w′ = (−lr)·g + w in float32 as tf.train.sgd computes it. */
export function sgdUpdate(inputs: readonly Float32Array[], outputs: Float32Array[], attrs: HostAttrs): void {
  const { count, learningRate } = attrs;
  const step = f32(-learningRate);
  for (let k = 0; k < count; k++) {
    const [w, g, wNext] = [inputs[k], inputs[count + k], outputs[k]];
    for (let i = 0; i < w.length; i++) wNext[i] = f32(f32(step * g[i]) + w[i]);
  }
}

type AdamOnHeap = (w: number, g: number, m: number, v: number, wNext: number, mNext: number, vNext: number, n: number, ...constants: number[]) => void;

/** adamUpdate's arithmetic in adam.wat, four elements at a time, on arrays that view `heap` (the same bits). */
function adamOnHeap(heap: WebAssembly.Memory, inputs: readonly Float32Array[], outputs: Float32Array[], attrs: HostAttrs): void {
  const { count, learningRate, correction1, correction2 } = attrs;
  const adam = wasmKernels('adam', heap).adam as AdamOnHeap;
  const constants = [BETA1, BETA2, 1 - BETA1, 1 - BETA2, EPSILON, -learningRate, correction1, correction2].map(f32);
  const at = (a: Float32Array) => a.byteOffset;
  for (let k = 0; k < count; k++) {
    const w = inputs[k];
    adam(at(w), at(inputs[count + k]), at(inputs[2 * count + k]), at(inputs[3 * count + k]), at(outputs[k]), at(outputs[count + k]), at(outputs[2 * count + k]), w.length, ...constants);
  }
}

const ADAM_KERNEL: HostKernel = {
  name: 'CrosswiseAdamUpdate',
  outputShapes: (shapes, { count }) => [...shapes.slice(0, count), ...shapes.slice(0, count), ...shapes.slice(0, count)],
  run: (inputs, outputs, attrs, _backend, heap) => (heap == null ? adamUpdate(inputs, outputs, attrs) : adamOnHeap(heap, inputs, outputs, attrs)),
};

const SGD_KERNEL: HostKernel = {
  name: 'CrosswiseSgdUpdate',
  outputShapes: (shapes, { count }) => shapes.slice(0, count),
  run: sgdUpdate,
};

/** Registers the optimisers' kernels on the wasm and cpu backends. */
export function registerOptimizerKernels(): void {
  registerHostKernel(ADAM_KERNEL);
  registerHostKernel(SGD_KERNEL);
}

/** Replaces each variable's value by the matching new tensor (which the caller's tidy frees). */
function assignAll(variables: readonly tf.Variable[], values: readonly tf.Tensor[]): void {
  variables.forEach((v, i) => v.assign(values[i]));
}

/** Adam whose whole step over every variable is one kernel; moments start at zero. */
class Adam implements Optimizer {
  private moments: tf.Variable[] = [];
  /** β1ᵗ and β2ᵗ after t steps, kept in float32 as tfjs keeps them. */
  private power1 = f32(BETA1);
  private power2 = f32(BETA2);

  constructor(private readonly learningRate: number) {}

  applyGradients(variables: readonly tf.Variable[], gradients: readonly tf.Tensor[]): void {
    if (this.moments.length === 0) {
      this.moments = tf.tidy(() => [...variables, ...variables].map((v) => tf.variable(tf.zerosLike(v), false)));
    }
    const count = variables.length;
    tf.tidy(() => {
      const attrs = { count, learningRate: this.learningRate, correction1: f32(1 - this.power1), correction2: f32(1 - this.power2) };
      const out = runHostKernel(ADAM_KERNEL.name, [...variables, ...gradients, ...this.moments], attrs);
      assignAll(variables, out.slice(0, count));
      assignAll(this.moments, out.slice(count));
    });
    this.power1 = f32(this.power1 * f32(BETA1));
    this.power2 = f32(this.power2 * f32(BETA2));
  }

  dispose(): void {
    tf.dispose(this.moments);
    this.moments = [];
  }
}

/** Gradient descent whose whole step is one kernel. */
class Sgd implements Optimizer {
  constructor(private readonly learningRate: number) {}

  applyGradients(variables: readonly tf.Variable[], gradients: readonly tf.Tensor[]): void {
    tf.tidy(() => assignAll(variables, runHostKernel(SGD_KERNEL.name, [...variables, ...gradients], { count: variables.length, learningRate: this.learningRate })));
  }

  dispose(): void {}
}

/** Every optimiser by its config name. */
export const OPTIMIZER_REGISTRY: Record<OptimizerName, (learningRate: number) => Optimizer> = {
  adam: (learningRate) => new Adam(learningRate),
  sgd: (learningRate) => new Sgd(learningRate),
};

/** The optimiser a learner's training settings name. */
export function createOptimizer(train: Pick<LearnerSpec['train'], 'optimizer' | 'learningRate'>): Optimizer {
  return OPTIMIZER_REGISTRY[train.optimizer](train.learningRate);
}
