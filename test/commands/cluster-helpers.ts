// Shared set-up of the cluster and status tests: a sweep whose cells are stored in-process
// with the test double cell work, and a stand-in for sbatch that records its arguments.
import { chmodSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { vi } from 'vitest';
import { loadSweep } from '../../src/experiment/config.js';
import { planCells } from '../../src/experiment/plan.js';
import { prepareOutput } from '../../src/experiment/runner.js';
import { storeCell } from '../../src/experiment/store.js';
import { cellWork } from '../experiment/fake-cell.js';

/** 2 vary combinations × 2 seeds × 2 learners = 8 cells, indices 0–7. */
export const EIGHT_CELLS = `name: cluster-test
world: world.yaml
seeds: [1, 2]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], train: { epochs: 1 } }
  - { name: untrained, objective: untrained, input: [sight] }
vary:
  learners.*.encoder.hidden: [[8], [16, 8]]
out: out
`;

/** The reason stored for a cell made to fail. */
export const FAILURE = 'LearnerDivergedError: loss became NaN at epoch 1';

/**
 * Stores the given cells of the config's plan in `out` as a run would: done ones with the
 * test double's scores, failed ones with FAILURE as their reason.
 */
export async function storeCells(config: string, out: string, cells: { readonly done?: readonly number[]; readonly failed?: readonly number[] }): Promise<void> {
  const sweep = loadSweep(config, { out });
  const planned = prepareOutput(sweep, false, () => undefined);
  for (const index of cells.done ?? []) {
    const outcome = await cellWork(planned[index], () => {});
    storeCell(out, planned[index], { status: 'done', outcome, totalSeconds: 0 }, sweep.varyKeys);
  }
  for (const index of cells.failed ?? []) {
    storeCell(out, planned[index], { status: 'failed', reason: FAILURE, log: [], totalSeconds: 0 }, sweep.varyKeys);
  }
}

/** The plan's cell ids, index by index. */
export function plannedIds(config: string): string[] {
  return planCells(loadSweep(config)).map((cell) => cell.id);
}

/**
 * A folder holding an `sbatch` that appends its arguments (one JSON array per call) to
 * `calls.jsonl` and prints job ids 101, 102, … in sbatch's --parsable form with a cluster
 * name (`101;main`), which the script must cut off.
 */
export function fakeSbatch(dir: string): { readonly bin: string; readonly calls: () => string[][] } {
  const bin = join(dir, 'fake-bin');
  mkdirSync(bin, { recursive: true });
  const log = join(bin, 'calls.jsonl');
  writeFileSync(log, '');
  writeFileSync(join(bin, 'sbatch'), `#!${process.execPath}
const fs = require('node:fs');
fs.appendFileSync(${JSON.stringify(log)}, JSON.stringify(process.argv.slice(2)) + '\\n');
const calls = fs.readFileSync(${JSON.stringify(log)}, 'utf8').trim().split('\\n').length;
console.log(\`\${100 + calls};main\`);
`);
  chmodSync(join(bin, 'sbatch'), 0o755);
  return { bin, calls: () => readFileSync(log, 'utf8').trim().split('\n').filter((l) => l !== '').map((l) => JSON.parse(l) as string[]) };
}

/** Collects what console.log and console.error print, line by line (restore with vi.restoreAllMocks). */
export function capture(): { readonly out: string[]; readonly err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((text: string) => { out.push(...String(text).split('\n')); });
  vi.spyOn(console, 'error').mockImplementation((text: string) => { err.push(...String(text).split('\n')); });
  return { out, err };
}
