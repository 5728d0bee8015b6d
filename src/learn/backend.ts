import * as tf from '@tensorflow/tfjs-core';
import '@tensorflow/tfjs-backend-cpu';
import '@tensorflow/tfjs-backend-wasm';
import { registerDenseKernels } from './dense-kernels.js';
import { registerOptimizerKernels } from './optimizers.js';
import { registerFastMatMulGradient } from './plain-matmul.js';
import { registerReluKernels } from './relu-kernels.js';
import { registerSpikingKernels } from './spiking-kernels.js';
import { registerSquaredErrorKernel } from './squared-error.js';
import { registerStockGradients } from './stock-gradients.js';
import { registerWasmMatMul } from './wasm-matmul.js';
import type { BackendName } from './spec.js';

let gradientsReady = false;

/**
 * Selects the tfjs backend (wasm or cpu) and registers gradients; safe to call repeatedly.
 *
 * The wasm binary is read from the installed `@tensorflow/tfjs-backend-wasm` package
 * (its Node build locates the `.wasm` next to itself; nothing is fetched). Production
 * mode silences the banner that recommends a native Node backend.
 */
export async function initBackend(name: BackendName = 'wasm'): Promise<void> {
  if (!gradientsReady) {
    tf.env().set('PROD', true);
    registerStockGradients();
    registerFastMatMulGradient();
    registerOptimizerKernels();
    registerDenseKernels();
    registerReluKernels();
    registerSquaredErrorKernel();
    registerSpikingKernels();
    registerWasmMatMul();
    gradientsReady = true;
  }
  // engine().backendName stays null until a backend is chosen; getBackend() would pick one.
  if (tf.engine().backendName === name) return;
  const ok = await tf.setBackend(name);
  if (!ok || tf.getBackend() !== name) throw new Error(`could not start the TensorFlow.js '${name}' backend`);
}

/** Versions and backend in use, for the software record beside each result. */
export function softwareVersions(): Record<string, string> {
  return { 'tfjs-core': tf.version_core, 'tfjs-backend': tf.engine().backendName ?? 'none' };
}
