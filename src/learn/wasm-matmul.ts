import * as tf from '@tensorflow/tfjs-core';
import type { BackendWasm } from '@tensorflow/tfjs-backend-wasm';
import { wasmHeap, wasmKernels } from './wasm-module.js';

type MatMul = (a: number, b: number, c: number, m: number, k: number, n: number, transposeA: number) => void;

interface MatMulAttrs {
  readonly transposeA: boolean;
  readonly transposeB: boolean;
}

const address = (backend: BackendWasm, t: tf.TensorInfo): number => backend.dataIdMap.get(t.dataId)!.memoryOffset;

/** Rows of a rank ≥ 2 shape once its leading (batch) axes are left out, or null when they hold more than one matrix. */
function single(shape: readonly number[]): [number, number] | null {
  const batch = shape.slice(0, -2).reduce((p, d) => p * d, 1);
  return shape.length >= 2 && batch === 1 ? [shape[shape.length - 2], shape[shape.length - 1]] : null;
}

/** The kernel registerWasmMatMul put in place, so a second call leaves it. */
let registered: tf.KernelFunc | null = null;

/**
 * Replaces the wasm backend's BatchMatMul with matmul.wat's products whenever both operands
 * are single float32 matrices and B is not transposed: the same bits (see matmul.wat), without
 * the packed copy of B that XNNPACK makes for every new B, and with Aᵀ read in place.
 * Every other case (batches, Bᵀ, other types) goes to the stock kernel.
 */
export function registerWasmMatMul(): void {
  const stock = tf.getKernel(tf.BatchMatMul, 'wasm');
  if (stock == null) throw new Error('the wasm backend has no BatchMatMul kernel to replace');
  if (stock.kernelFunc === registered) return;
  const stockFunc = stock.kernelFunc;
  const wasmMatMul = (args: Parameters<tf.KernelFunc>[0]): tf.TensorInfo | tf.TensorInfo[] => {
    const { a, b } = args.inputs as { a: tf.TensorInfo; b: tf.TensorInfo };
    const { transposeA, transposeB } = args.attrs as unknown as MatMulAttrs;
    const aRows = single(a.shape);
    const bRows = single(b.shape);
    if (aRows == null || bRows == null || transposeB || a.dtype !== 'float32' || b.dtype !== 'float32') return stockFunc(args);
    const [m, k] = transposeA ? [aRows[1], aRows[0]] : aRows;
    const [kB, n] = bRows;
    if (k !== kB) throw new Error(`matMul: inner sizes ${k} and ${kB} of shapes [${a.shape.join(', ')}] and [${b.shape.join(', ')}] (transposeA=${transposeA}) must match`);
    const backend = args.backend as BackendWasm;
    const rank = Math.max(a.shape.length, b.shape.length);
    const out = backend.makeOutput([...new Array<number>(rank - 2).fill(1), m, n], 'float32');
    const matmul = wasmKernels('matmul', wasmHeap(backend)).matmul as MatMul;
    matmul(address(backend, a), address(backend, b), address(backend, out), m, k, n, transposeA ? 1 : 0);
    return out;
  };
  registered = wasmMatMul as tf.KernelFunc;
  tf.unregisterKernel(tf.BatchMatMul, 'wasm');
  tf.registerKernel({ ...stock, kernelFunc: registered });
}
