import * as tf from '@tensorflow/tfjs-core';
import { registerHostKernel, runHostKernel, type HostBackend, type HostKernel } from './host-kernels.js';
import { wasmKernels } from './wasm-module.js';

// The two data movements of a dense layer's backward pass, as host kernels: on wasm,
// tfjs's Transpose walks every element through a general N-d index and its Sum over
// axis 0 transposes first, both several times slower than these plain loops.

/** Side of the square blocks a transpose copies, so reads and writes both stay in cache. */
const BLOCK = 32;

/** xᵀ of a row-major [rows, cols] matrix, written to `out` ([cols, rows]). */
export function transposeInto(x: Float32Array, rows: number, cols: number, out: Float32Array): void {
  for (let r0 = 0; r0 < rows; r0 += BLOCK) {
    const r1 = Math.min(r0 + BLOCK, rows);
    for (let c0 = 0; c0 < cols; c0 += BLOCK) {
      const c1 = Math.min(c0 + BLOCK, cols);
      for (let r = r0; r < r1; r++) {
        for (let c = c0; c < c1; c++) out[c * rows + r] = x[r * cols + c];
      }
    }
  }
}

/**
 * Column sums of a row-major [rows, cols] matrix, written to `out` ([cols]). Each column is
 * added row by row from zero, as the backend's own Sum over axis 0 adds it: in float32 on
 * wasm (tfjs-backend-wasm's Sum accumulates in the tensor's type), in float64 rounded once
 * on cpu (tfjs-backend-cpu accumulates in a JavaScript number).
 */
export function columnSumsInto(x: Float32Array, rows: number, cols: number, out: Float32Array, backend: HostBackend): void {
  if (backend === 'wasm') {
    out.fill(0);
    addRows(x, rows, cols, out);
  } else {
    const sums = new Float64Array(cols);
    addRows(x, rows, cols, sums);
    out.set(sums);
  }
}

/** sums[c] += x[r, c] for every row in order; the precision is the type of `sums`. */
function addRows<T extends Float32Array | Float64Array>(x: Float32Array, rows: number, cols: number, sums: T): void {
  for (let r = 0; r < rows; r++) {
    const row = r * cols;
    for (let c = 0; c < cols; c++) sums[c] += x[row + c];
  }
}

type TransposeOnHeap = (x: number, out: number, rows: number, cols: number) => void;

const TRANSPOSE: HostKernel = {
  name: 'CrosswiseTranspose2D',
  outputShapes: ([[rows, cols]]) => [[cols, rows]],
  // On wasm, dense-kernels.wat copies four rows at a time.
  run: ([x], [out], { rows, cols }, _backend, heap) => (heap == null
    ? transposeInto(x, rows, cols, out)
    : (wasmKernels('dense-kernels', heap).transpose as TransposeOnHeap)(x.byteOffset, out.byteOffset, rows, cols)),
};

type ColumnSumsOnHeap = (x: number, out: number, rows: number, cols: number) => void;

const COLUMN_SUMS: HostKernel = {
  name: 'CrosswiseColumnSums',
  outputShapes: ([[, cols]]) => [[cols]],
  // On wasm, dense-kernels.wat runs the same float32 additions four columns at a time.
  run: ([x], [out], { rows, cols }, backend, heap) => (heap == null
    ? columnSumsInto(x, rows, cols, out, backend)
    : (wasmKernels('dense-kernels', heap).columnSums as ColumnSumsOnHeap)(x.byteOffset, out.byteOffset, rows, cols)),
};

/** out [n, cols] = rows `rows[i]` of x [·, cols], in order. */
export function gatherRowsInto(x: Float32Array, rows: Float32Array, cols: number, out: Float32Array): void {
  for (let i = 0; i < rows.length; i++) out.set(x.subarray(rows[i] * cols, (rows[i] + 1) * cols), i * cols);
}

type GatherRowsOnHeap = (x: number, rows: number, out: number, n: number, cols: number) => void;

const GATHER_ROWS: HostKernel = {
  name: 'CrosswiseGatherRows',
  outputShapes: ([[, cols], [n]]) => [[n, cols]],
  // On wasm, dense-kernels.wat copies each row with memory.copy.
  run: ([x, rows], [out], { cols }, _backend, heap) => (heap == null
    ? gatherRowsInto(x, rows, cols, out)
    : (wasmKernels('dense-kernels', heap).gatherRows as GatherRowsOnHeap)(x.byteOffset, rows.byteOffset, out.byteOffset, rows.length, cols)),
};

/** Registers the dense-layer kernels on the wasm and cpu backends, and the transpose's gradient (the transpose of dy). */
export function registerDenseKernels(): void {
  registerHostKernel(TRANSPOSE);
  registerHostKernel(COLUMN_SUMS);
  registerHostKernel(GATHER_ROWS);
  tf.registerGradient({ kernelName: TRANSPOSE.name, gradFunc: (dy) => ({ 0: () => transpose2d(dy as tf.Tensor2D) }) });
}

function rowsAndCols(x: tf.Tensor2D): { rows: number; cols: number } {
  if (x.rank !== 2) throw new Error(`expected a matrix, got shape [${x.shape.join(', ')}]`);
  return { rows: x.shape[0], cols: x.shape[1] };
}

/**
 * The rows of x [N, cols] that `rows` ([n] float32, whole numbers below N) names, in order:
 * [n, cols]. Rows are indexed in float32, so N must stay below 2²⁴.
 */
export function gatherRows(x: tf.Tensor2D, rows: tf.Tensor1D): tf.Tensor2D {
  const { cols } = rowsAndCols(x);
  if (rows.rank !== 1) throw new Error(`gatherRows: expected a vector of row indices, got shape [${rows.shape.join(', ')}]`);
  return runHostKernel(GATHER_ROWS.name, [x, rows], { cols })[0] as tf.Tensor2D;
}

/** xᵀ of a matrix, [rows, cols] → [cols, rows]. */
export function transpose2d(x: tf.Tensor2D): tf.Tensor2D {
  return runHostKernel(TRANSPOSE.name, [x], rowsAndCols(x))[0] as tf.Tensor2D;
}

/** Σ over rows, [rows, cols] → [cols]: the same numbers as tf.sum(x, 0) on the current backend. */
export function columnSums(x: tf.Tensor2D): tf.Tensor1D {
  return runHostKernel(COLUMN_SUMS.name, [x], rowsAndCols(x))[0] as tf.Tensor1D;
}

/**
 * a·b, a·bᵀ, aᵀ·b or aᵀ·bᵀ, with the same bits as tf.matMul of explicitly transposed operands.
 * bᵀ is always copied (tfjs's kernels run far slower with that flag); on wasm, aᵀ is read in
 * place by the product itself (wasm-matmul.ts), elsewhere it is copied too.
 */
export function matMulT(a: tf.Tensor2D, b: tf.Tensor2D, transposeA: boolean, transposeB: boolean): tf.Tensor2D {
  const opB = transposeB ? transpose2d(b) : b;
  if (transposeA && tf.getBackend() === 'wasm') return tf.matMul(a, opB, true, false);
  return tf.matMul(transposeA ? transpose2d(a) : a, opB);
}
