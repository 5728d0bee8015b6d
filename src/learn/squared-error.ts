import * as tf from '@tensorflow/tfjs-core';
import { registerHostKernel, runHostKernel, type HostKernel } from './host-kernels.js';
import { wasmKernels } from './wasm-module.js';

const f32 = Math.fround;

/**
 * Both gradients of L = dy · mean((a − b)²) over n elements, as tfjs-core's own gradients
 * of Mean and SquaredDifference compute them (gradients/Mean_grad.js: dy · 1 / n;
 * SquaredDifference_grad.js: g · (2 · (a − b)) and g · (2 · (b − a))), each operation
 * rounded to float32 in that order, so the bits are autodiff's.
 */
export function squaredErrorGradientsInto(a: Float32Array, b: Float32Array, dy: number, dA: Float32Array, dB: Float32Array): void {
  const g = f32(dy / a.length);
  for (let i = 0; i < a.length; i++) {
    dA[i] = g * f32(2 * f32(a[i] - b[i]));
    dB[i] = g * f32(2 * f32(b[i] - a[i]));
  }
}

type SquaredErrorGradientsOnHeap = (a: number, b: number, dA: number, dB: number, n: number, g: number) => void;

const SQUARED_ERROR_GRADIENTS: HostKernel = {
  name: 'CrosswiseSquaredErrorGradients',
  outputShapes: ([a, b]) => [a, b],
  // On wasm, squared-error.wat runs the same float32 operations four elements at a time.
  run: ([a, b, dy], [dA, dB], _attrs, _backend, heap) => (heap == null
    ? squaredErrorGradientsInto(a, b, dy[0], dA, dB)
    : (wasmKernels('squared-error', heap).squaredErrorGradients as SquaredErrorGradientsOnHeap)(a.byteOffset, b.byteOffset, dA.byteOffset, dB.byteOffset, a.length, f32(dy[0] / a.length))),
};

/** Registers the squared-error kernel on the wasm and cpu backends. */
export function registerSquaredErrorKernel(): void {
  registerHostKernel(SQUARED_ERROR_GRADIENTS);
}

/**
 * mean((a − b)²) over every element, whose gradient is one kernel instead of the six or so
 * that autodiff runs through Mean and SquaredDifference (the same bits).
 */
export const meanSquaredDifference = tf.customGrad((...args: (tf.Tensor | tf.GradSaveFunc)[]) => {
  const [a, b, save] = args as [tf.Tensor, tf.Tensor, tf.GradSaveFunc];
  save([a, b]);
  return {
    value: tf.mean(tf.squaredDifference(a, b)),
    gradFunc: (dy: tf.Tensor, [savedA, savedB]: tf.Tensor[]) => runHostKernel(SQUARED_ERROR_GRADIENTS.name, [savedA, savedB, dy], {}),
  };
}) as (a: tf.Tensor2D, b: tf.Tensor2D) => tf.Scalar;
