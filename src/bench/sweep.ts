import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { timeCli } from './cli-process.js';
import { figureOf, type Figure } from './figure.js';

/** The fixed 15-cell copy of the quickstart that the sweep figures time. */
export const FIXED_QUICKSTART = fileURLToPath(new URL('./quickstart-15.yaml', import.meta.url));

/** Wall seconds of one `crosswise run` of the fixed quickstart into a fresh folder, report included. */
function runOnce(jobs: number): number {
  const out = mkdtempSync(join(tmpdir(), 'crosswise-bench-'));
  try {
    return timeCli(['run', FIXED_QUICKSTART, '--out', out, '--plain', '--jobs', String(jobs)]);
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
}

/**
 * Wall time of the fixed quickstart with one worker and with two, each from process start to
 * the written report; one `--jobs 2` run warms the caches first. `onRun` hears of each run,
 * since every one takes most of a minute.
 */
export function benchQuickstart(repeats: number, onRun: (label: string) => void): { jobs1: Figure; jobs2: Figure } {
  onRun('warm-up, --jobs 2');
  runOnce(2);
  const times = (jobs: number) => figureOf(Array.from({ length: repeats }, (_, r) => {
    onRun(`--jobs ${jobs}, ${r + 1} of ${repeats}`);
    return runOnce(jobs);
  }));
  return { jobs1: times(1), jobs2: times(2) };
}
