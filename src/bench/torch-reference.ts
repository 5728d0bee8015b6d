import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { BenchResult } from './result.js';

const SCRIPT = fileURLToPath(new URL('./torch-reference.py', import.meta.url));
// The first interpreter on PATH may be a private one (pyenv, conda) that cannot see the
// system's packages, so the system interpreter is tried as well.
const PYTHONS = ['python3', '/usr/bin/python3'];

/**
 * The reference MLP trained by PyTorch on one CPU thread, when python3 can import torch;
 * otherwise a line saying it is absent. Nothing is installed or downloaded.
 */
export async function benchTorchReference(opts: { quick: boolean }): Promise<BenchResult[]> {
  const python = PYTHONS.find((candidate) => spawnSync(candidate, ['-c', 'import torch']).status === 0);
  if (python == null) {
    return [{ name: 'train reference MLP (PyTorch)', value: NaN, unit: 'samples/s', detail: 'not present: python3 cannot import torch (e.g. Debian python3-torch)' }];
  }
  const run = spawnSync(python, [SCRIPT, ...(opts.quick ? ['--quick'] : [])], { encoding: 'utf8' });
  if (run.status !== 0) throw new Error(`PyTorch reference failed: ${run.stderr.trim().split('\n').pop()}`);
  const result = JSON.parse(run.stdout) as { samples_per_s: number; torch: string; rounds: number };
  return [{
    name: 'train reference MLP (PyTorch)',
    value: result.samples_per_s,
    unit: 'samples/s',
    detail: `160→128→128→48 relu, MSE, adam, batch 256, torch ${result.torch}, one CPU thread, median of ${result.rounds}`,
  }];
}
