import * as tf from '@tensorflow/tfjs-core';
import { registerHostKernel, runHostKernel, type HostKernel } from './host-kernels.js';
import { wasmKernels } from './wasm-module.js';

// A relu layer's element-wise work as one kernel each way: forward, x·W + b and its relu
// (tfjs: Add, Relu); backward, g ⊙ relu′(pre) (tfjs: Step, Multiply). Each output has the
// bits of those tfjs kernels: every element is one float32 operation per tfjs kernel, and
// relu and step agree with tfjs at 0, −0 and NaN (relu = max(x, 0) with NaN kept and
// relu(−0) = +0, as both backends compute it, measured in the tests; step: NaN stays NaN,
// else x > 0 ? 1 : 0, tfjs-backend-cpu and -wasm alike). On wasm the loops run in
// relu-kernels.wat.

/** pre = a + b row by row and post = relu(pre), for a [rows, cols] and b [cols]. */
export function biasReluInto(a: Float32Array, b: Float32Array, pre: Float32Array, post: Float32Array): void {
  const cols = b.length;
  for (let i = 0; i < a.length; i++) {
    pre[i] = a[i] + b[i % cols]; // stored in a Float32Array: the float32 sum
    post[i] = Math.max(0, pre[i]);
  }
}

/** δ = g ⊙ step(pre), step(p) = NaN for NaN, else p > 0 ? 1 : 0 (the derivative of relu that tfjs uses). */
export function reluBackwardInto(g: Float32Array, pre: Float32Array, delta: Float32Array): void {
  for (let i = 0; i < g.length; i++) {
    const p = pre[i];
    delta[i] = g[i] * (Number.isNaN(p) ? p : p > 0 ? 1 : 0);
  }
}

type BiasReluOnHeap = (a: number, b: number, pre: number, post: number, rows: number, cols: number) => void;
type ReluBackwardOnHeap = (g: number, pre: number, delta: number, n: number) => void;

const BIAS_RELU: HostKernel = {
  name: 'CrosswiseBiasRelu',
  outputShapes: ([shape]) => [shape, shape],
  run: ([a, b], [pre, post], _attrs, _backend, heap) => (heap == null
    ? biasReluInto(a, b, pre, post)
    : (wasmKernels('relu-kernels', heap).biasRelu as BiasReluOnHeap)(a.byteOffset, b.byteOffset, pre.byteOffset, post.byteOffset, a.length / b.length, b.length)),
};

const RELU_BACKWARD: HostKernel = {
  name: 'CrosswiseReluBackward',
  outputShapes: ([shape]) => [shape],
  run: ([g, pre], [delta], _attrs, _backend, heap) => (heap == null
    ? reluBackwardInto(g, pre, delta)
    : (wasmKernels('relu-kernels', heap).reluBackward as ReluBackwardOnHeap)(g.byteOffset, pre.byteOffset, delta.byteOffset, g.length)),
};

/** Registers the relu kernels on the wasm and cpu backends. */
export function registerReluKernels(): void {
  registerHostKernel(BIAS_RELU);
  registerHostKernel(RELU_BACKWARD);
}

/** [a + b, relu(a + b)] for a [rows, cols] and b [cols]: the pre-activation and activation of a relu layer. */
export function biasRelu(a: tf.Tensor2D, b: tf.Tensor1D): [tf.Tensor2D, tf.Tensor2D] {
  if (a.rank !== 2 || b.rank !== 1 || b.shape[0] !== a.shape[1]) throw new Error(`biasRelu: expected [rows, cols] and [cols], got [${a.shape.join(', ')}] and [${b.shape.join(', ')}]`);
  const [pre, post] = runHostKernel(BIAS_RELU.name, [a, b], {});
  return [pre as tf.Tensor2D, post as tf.Tensor2D];
}

/** g ⊙ relu′(pre), the error at a relu layer's pre-activation from the signal g at its output. */
export function reluBackward(g: tf.Tensor2D, pre: tf.Tensor2D): tf.Tensor2D {
  if (!tf.util.arraysEqual(g.shape, pre.shape)) throw new Error(`reluBackward: shapes [${g.shape.join(', ')}] and [${pre.shape.join(', ')}] differ`);
  return runHostKernel(RELU_BACKWARD.name, [g, pre], {})[0] as tf.Tensor2D;
}
