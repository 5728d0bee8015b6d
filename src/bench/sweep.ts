import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { readCellRecord, type CellRecord } from '../results/cell-record.js';
import { outputPath } from '../results/layout.js';
import type { BenchResult } from './result.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const QUICKSTART = join(ROOT, 'configs', 'quickstart.yaml');
const CLI = join(ROOT, 'bin', 'crosswise.js');

function runCli(args: readonly string[]): number {
  const t0 = performance.now();
  const result = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  if (result.status !== 0) throw new Error(`crosswise ${args.join(' ')} exited with ${result.status}: ${result.stderr.trim().split('\n')[0]}`);
  return (performance.now() - t0) / 1000;
}

function cellTimings(out: string): CellRecord['seconds'][] {
  return readdirSync(outputPath(out, 'cells')).map((id) => readCellRecord(out, id).seconds);
}

const sum = (values: readonly number[]) => values.reduce((a, b) => a + b, 0);

/**
 * Wall time of the quickstart sweep (`npm start`) in a fresh output folder, and where the
 * time goes: collect, train and probe summed over cells (CPU-side seconds inside the
 * workers, so they add up to more than the wall time when workers run side by side),
 * and the report rebuilt on its own.
 */
export async function benchSweep(): Promise<BenchResult[]> {
  const out = mkdtempSync(join(tmpdir(), 'crosswise-bench-'));
  try {
    const jobs = availableParallelism();
    const wallS = runCli(['run', QUICKSTART, '--out', out, '--plain', '--jobs', String(jobs)]);
    const cells = cellTimings(out);
    const reportS = runCli(['report', out]);
    const detail = `${cells.length} cells, summed over cells on ${jobs} workers`;
    return [
      { name: 'quickstart sweep', value: wallS, unit: 's wall', detail: `configs/quickstart.yaml, ${cells.length} cells, --jobs ${jobs}, including the report` },
      { name: 'quickstart collect', value: sum(cells.map((c) => c.collect)), unit: 's', detail },
      { name: 'quickstart train', value: sum(cells.map((c) => c.train)), unit: 's', detail },
      { name: 'quickstart probe', value: sum(cells.map((c) => c.probe)), unit: 's', detail },
      { name: 'quickstart report', value: reportS, unit: 's wall', detail: 'crosswise report on the finished sweep, process start included' },
    ];
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
}
