import * as tf from '@tensorflow/tfjs-core';
import type { MathBackendCPU } from '@tensorflow/tfjs-backend-cpu';
import type { BackendWasm } from '@tensorflow/tfjs-backend-wasm';
import { wasmHeap } from './wasm-module.js';

/** The backends a host kernel runs on. */
export type HostBackend = 'wasm' | 'cpu';

/** Scalar settings of a host kernel. */
export type HostAttrs = Readonly<Record<string, number>>;

/**
 * A kernel written as one plain loop over float32 arrays. Each tfjs kernel dispatch costs
 * several microseconds of bookkeeping however small the arithmetic, so an update that
 * tfjs would spread over dozens of element-wise kernels runs here as one.
 */
export interface HostKernel {
  readonly name: string;
  /** Shapes of the outputs, from the shapes of the inputs. */
  outputShapes(inputShapes: readonly number[][], attrs: HostAttrs): number[][];
  /**
   * Reads `inputs`, fills every element of every `outputs` array. `backend` lets a kernel
   * reproduce the backend's own arithmetic where the two differ (e.g. reduction precision).
   * On wasm `heap` is the backend's memory, which the arrays view (their byteOffset is their
   * address), so a kernel may hand them to WebAssembly code (wasm-module.ts); null on cpu.
   */
  run(inputs: readonly Float32Array[], outputs: Float32Array[], attrs: HostAttrs, backend: HostBackend, heap: WebAssembly.Memory | null): void;
}

const size = (shape: readonly number[]): number => shape.reduce((a, b) => a * b, 1);

/** Inputs in the order runHostKernel passed them (keyed '0', '1', …). */
function ordered(inputs: tf.NamedTensorInfoMap): tf.TensorInfo[] {
  return Object.keys(inputs).map((_, i) => {
    const info = inputs[i];
    if (info == null) throw new Error(`host kernel input ${i} is missing`);
    return info;
  });
}

function checkFloat32(kernel: string, infos: readonly tf.TensorInfo[]): void {
  const other = infos.find((t) => t.dtype !== 'float32');
  if (other != null) throw new Error(`${kernel}: expected float32 inputs, got ${other.dtype}`);
}

/** A backend's tensors as float32 arrays: inputs read in place, outputs allocated to be filled. */
interface BackendArrays {
  input(info: tf.TensorInfo): Float32Array;
  outputs(shapes: readonly number[][]): { arrays: Float32Array[]; infos(): tf.TensorInfo[] };
}

const BACKEND_ARRAYS: Record<HostBackend, (backend: unknown) => BackendArrays> = {
  // Views into the wasm heap, so nothing is copied.
  wasm: (backend) => {
    const wasm = backend as BackendWasm;
    const view = (t: tf.TensorInfo) => wasm.typedArrayFromHeap(t) as Float32Array;
    return {
      input: view,
      outputs(shapes) {
        const infos = shapes.map((shape) => wasm.makeOutput(shape, 'float32'));
        return { arrays: infos.map(view), infos: () => infos };
      },
    };
  },
  // The cpu backend keeps every tensor in a plain typed array.
  cpu: (backend) => {
    const cpu = backend as MathBackendCPU;
    return {
      input: (t) => cpu.data.get(t.dataId)!.values as Float32Array,
      outputs(shapes) {
        const arrays = shapes.map((shape) => new Float32Array(size(shape)));
        return { arrays, infos: () => arrays.map((values, i) => cpu.makeTensorInfo(shapes[i], 'float32', values)) };
      },
    };
  },
};

function kernelConfig(kernel: HostKernel, backendName: HostBackend): tf.KernelConfig {
  const kernelFunc = ({ inputs, backend, attrs }: { inputs: tf.NamedTensorInfoMap; backend: unknown; attrs?: tf.NamedAttrMap }) => {
    const infos = ordered(inputs);
    checkFloat32(kernel.name, infos);
    const settings = (attrs ?? {}) as HostAttrs;
    const memory = BACKEND_ARRAYS[backendName](backend);
    const outputs = memory.outputs(kernel.outputShapes(infos.map((t) => t.shape), settings));
    // Inputs are viewed after the outputs exist: on wasm, growing the heap detaches earlier views.
    const heap = backendName === 'wasm' ? wasmHeap(backend as BackendWasm) : null;
    kernel.run(infos.map(memory.input), outputs.arrays, settings, backendName, heap);
    return outputs.infos();
  };
  return { kernelName: kernel.name, backendName, kernelFunc: kernelFunc as tf.KernelFunc };
}

/** Registers a host kernel on the wasm and cpu backends (once per process). */
export function registerHostKernel(kernel: HostKernel): void {
  if (tf.getKernel(kernel.name, 'wasm') != null) return;
  tf.registerKernel(kernelConfig(kernel, 'wasm'));
  tf.registerKernel(kernelConfig(kernel, 'cpu'));
}

/** Runs a registered host kernel on the current backend; the outputs are new tensors. */
export function runHostKernel(name: string, inputs: readonly tf.Tensor[], attrs: HostAttrs): tf.Tensor[] {
  const named = Object.fromEntries(inputs.map((t, i) => [String(i), t]));
  const result = tf.engine().runKernel(name, named, attrs as unknown as tf.NamedAttrMap);
  return Array.isArray(result) ? result : [result];
}
