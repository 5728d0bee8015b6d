import * as tf from '@tensorflow/tfjs-core';
import { transpose2d } from './dense-kernels.js';

/** Swaps the last two axes of a rank ≥ 2 tensor (a matrix by dense-kernels.ts's faster copy). */
export function transposeLast(x: tf.Tensor): tf.Tensor {
  if (x.rank === 2) return transpose2d(x as tf.Tensor2D);
  const perm = x.shape.map((_, i) => i);
  const r = perm.length;
  [perm[r - 2], perm[r - 1]] = [perm[r - 1], perm[r - 2]];
  return tf.transpose(x, perm);
}

/**
 * A matrix product that never asks the backend for a transposed operand.
 *
 * The wasm backend's BatchMatMul runs at 0.5–1.6 GFLOP/s with a transpose flag against
 * ~20 without (measured with tfjs-backend-wasm 4.22.0 under Node 20), so an explicit
 * transpose copy is far cheaper.
 */
export function matMulPlain(a: tf.Tensor, b: tf.Tensor, transposeA = false, transposeB = false): tf.Tensor {
  return tf.matMul(transposeA ? transposeLast(a) : a, transposeB ? transposeLast(b) : b);
}

/**
 * Re-registers the BatchMatMul gradient so that on wasm it uses plain products.
 *
 * For C = op(A)·op(B): dop(A) = dC·op(B)ᵀ and dop(B) = op(A)ᵀ·dC, then each is transposed
 * back if its operand was transposed. Other backends keep tfjs-core's formulation, which
 * passes transpose flags. Must run after `registerStockGradients` (the later registration
 * wins).
 */
export function registerFastMatMulGradient(): void {
  const stock = tf.getGradient(tf.BatchMatMul);
  if (stock == null) throw new Error('BatchMatMul gradient missing: register the stock gradients first');
  tf.registerGradient({
    kernelName: tf.BatchMatMul,
    inputsToSave: ['a', 'b'],
    gradFunc: (dy, saved, attrs) => {
      if (tf.getBackend() !== 'wasm') return stock.gradFunc(dy, saved, attrs);
      const [a, b] = saved;
      const { transposeA, transposeB } = attrs as unknown as { transposeA: boolean; transposeB: boolean };
      const dyT = dy as tf.Tensor;
      return {
        a: () => {
          const opB = transposeB ? transposeLast(b) : b;
          const dOpA = tf.matMul(dyT, transposeLast(opB));
          return transposeA ? transposeLast(dOpA) : dOpA;
        },
        b: () => {
          // op(A)ᵀ·dy: A itself when A was transposed; otherwise Aᵀ, which wasm-matmul.ts reads in place for a matrix.
          const dOpB = transposeA ? tf.matMul(a, dyT) : a.rank === 2 ? tf.matMul(a, dyT, true, false) : tf.matMul(transposeLast(a), dyT);
          return transposeB ? transposeLast(dOpB) : dOpB;
        },
      };
    },
  });
}
