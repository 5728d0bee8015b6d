import { fileURLToPath } from 'node:url';
import { figureOf, type Figure } from './figure.js';
import { findPython, runPythonJson } from './python.js';

const SCRIPT = fileURLToPath(new URL('./torch-reference.py', import.meta.url));

/** PyTorch's figure for the reference MLP and the BLAS under it. */
export interface TorchReference {
  readonly samplesPerS: Figure;
  readonly torch: string;
  /** 'openblas', 'mkl', 'blis', 'atlas', 'reference' (Netlib's unoptimised BLAS) or 'unknown'. */
  readonly blas: string;
  readonly blasLibrary: string;
  /** A line to print when the figure understates PyTorch, or null. */
  readonly warning: string | null;
}

/**
 * The reference MLP trained by PyTorch on one thread (OPENBLAS_NUM_THREADS=1 and
 * torch.set_num_threads(1)), a warm-up epoch then `repeats` timed ones; null when no Python
 * on this machine imports torch. Nothing is installed or downloaded.
 */
export function benchTorchReference(repeats: number, quick: boolean): TorchReference | null {
  const python = findPython(['torch']);
  if (python == null) return null;
  const result = runPythonJson<{ samples_per_s: number[]; torch: string; blas: string; blas_library: string }>(python, SCRIPT, [String(repeats), quick ? '2560' : '10240']);
  const warning = result.blas === 'reference'
    ? `PyTorch runs on the reference BLAS (${result.blas_library}), about ten times slower than with OpenBLAS; on Debian install libopenblas0-pthread for a fair comparison`
    : null;
  return { samplesPerS: figureOf(result.samples_per_s), torch: result.torch, blas: result.blas, blasLibrary: result.blas_library, warning };
}
