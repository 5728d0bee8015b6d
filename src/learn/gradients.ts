import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { threadId } from 'node:worker_threads';
import vm from 'node:vm';
import { buildSync } from 'esbuild';
import * as tf from '@tensorflow/tfjs-core';

const require = createRequire(import.meta.url);

/** Bundles tfjs-core's gradient registration module into one self-contained script. */
function bundleGradients(): string {
  const entry = require.resolve('@tensorflow/tfjs-core/dist/register_all_gradients.js');
  const bundle = buildSync({
    entryPoints: [entry], bundle: true, format: 'iife', platform: 'node', write: false, logLevel: 'silent',
  });
  return bundle.outputFiles[0].text;
}

/**
 * The bundle, cached in node_modules/.cache under the tfjs-core version (bundling costs
 * 0.2–2 s per process or worker; reading the cache ~1 ms). Written to a temporary name
 * and renamed, so concurrent processes never read half a file; a read-only install just
 * bundles every time.
 */
function cachedBundle(): string {
  const corePackage = require.resolve('@tensorflow/tfjs-core/package.json');
  const { version } = JSON.parse(readFileSync(corePackage, 'utf8')) as { version: string };
  const cacheDir = join(dirname(corePackage), '..', '..', '.cache', 'crosswise');
  const cacheFile = join(cacheDir, `tfjs-core-${version}-register-all-gradients.js`);
  if (existsSync(cacheFile)) return readFileSync(cacheFile, 'utf8');
  const text = bundleGradients();
  try {
    mkdirSync(cacheDir, { recursive: true });
    const temporary = `${cacheFile}.${process.pid}.${threadId}.tmp`;
    writeFileSync(temporary, text);
    renameSync(temporary, cacheFile);
  } catch {
    // No writable cache: the bundle is still used, just rebuilt next time.
  }
  return text;
}

/**
 * Registers tfjs-core's own gradient functions, which its Node entry leaves out.
 *
 * Why a bundle rather than the umbrella `@tensorflow/tfjs` package: the umbrella is not a
 * dependency and would pull in layers, converter and data just to run one registration
 * module; that module (`dist/register_all_gradients.js`) cannot be imported by Node
 * directly because its ESM imports have no file extensions. esbuild (installed with tsx)
 * bundles it into one script, which we run once. Built from the installed tfjs-core, it
 * cannot drift from it the way a committed copy could, and it registers into the same
 * engine because tfjs-core keeps its engine and registries on `globalThis` and
 * recognises tensors from another copy of itself by their shape (`Symbol.hasInstance`).
 */
export function registerStockGradients(): void {
  vm.runInThisContext(cachedBundle(), { filename: 'tfjs-core-register-all-gradients.js' });
}

/** Swaps the last two axes of a rank ≥ 2 tensor. */
export function transposeLast(x: tf.Tensor): tf.Tensor {
  const perm = x.shape.map((_, i) => i);
  const r = perm.length;
  [perm[r - 2], perm[r - 1]] = [perm[r - 1], perm[r - 2]];
  return tf.transpose(x, perm);
}

/**
 * A matrix product that never asks the backend for a transposed operand.
 *
 * The wasm backend's BatchMatMul runs at 0.5–1.6 GFLOP/s with a transpose flag against
 * ~20 without (measured, STACK.md), so an explicit transpose copy is far cheaper.
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
          const opA = transposeA ? transposeLast(a) : a;
          const dOpB = tf.matMul(transposeLast(opA), dyT);
          return transposeB ? transposeLast(dOpB) : dOpB;
        },
      };
    },
  });
}
