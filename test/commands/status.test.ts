// crosswise status: exact text for each state of a sweep, its exit code, and a resubmit
// command that, run as printed, covers exactly the missing cells.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { clusterCommand } from '../../src/commands/cluster.js';
import { statusCommand } from '../../src/commands/status.js';
import { configFolder } from '../experiment/helpers.js';
import { capture, EIGHT_CELLS, FAILURE, plannedIds, storeCells } from './cluster-helpers.js';

describe('crosswise status', () => {
  afterEach(() => vi.restoreAllMocks());

  it('lists done, failed (with reason) and missing cells by index and the command that resubmits the missing ones; exit 2', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const [config, out] = [join(dir, 'config.yaml'), join(dir, 'out')];
    await storeCells(config, out, { done: [0, 1, 2, 4], failed: [5] });
    capture();
    expect(await clusterCommand([config, '--out', out, '--time', '30', '--max-array-size', '100'])).toBe(0);
    vi.restoreAllMocks();
    const { out: lines } = capture();
    expect(await statusCommand([out])).toBe(2);
    const id5 = plannedIds(config)[5];
    expect(lines).toEqual([
      `${out}: 8 cells, 4 done, 1 failed, 3 missing`,
      'done     0-2,4',
      `failed   5 untrained seed 1 (${id5}): ${FAILURE}`,
      'missing  3,6-7',
      'resubmit the 3 missing cells with:',
      `  crosswise cluster '${config}' --out '${out}' --time 30 --max-array-size 100 && bash '${out}/array-job.sh'`,
      'add --retry-failed to crosswise cluster to run the 1 failed cell again too',
    ]);
  });

  it('says every cell is done and exits 0 when none failed or is missing', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    await storeCells(join(dir, 'config.yaml'), out, { done: [0, 1, 2, 3, 4, 5, 6, 7] });
    const { out: lines } = capture();
    expect(await statusCommand([out])).toBe(0);
    expect(lines).toEqual([
      `${out}: 8 cells, 8 done, 0 failed, 0 missing`,
      'done     0-7',
      'missing  none',
      `every cell is done; the report: crosswise report '${out}'`,
    ]);
  });

  it('with failed cells and none missing, exits 3 and gives the command with --retry-failed', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    await storeCells(join(dir, 'config.yaml'), out, { done: [0, 1, 2, 3, 4, 5], failed: [6, 7] });
    const { out: lines } = capture();
    expect(await statusCommand([out])).toBe(3);
    expect(lines.slice(-2)).toEqual([
      'run the 2 failed cells again with:',
      `  crosswise cluster '${out}/config.resolved.yaml' --out '${out}' --retry-failed && bash '${out}/array-job.sh'`,
    ]);
  });

  it("without a job-array script, resubmits from the folder's config.resolved.yaml, whose plan gives exactly the missing cells", async () => {
    const dir = configFolder(EIGHT_CELLS);
    const out = join(dir, 'out');
    await storeCells(join(dir, 'config.yaml'), out, { done: [0, 2, 3, 4, 5, 6] });
    const { out: lines } = capture();
    expect(await statusCommand([out])).toBe(2);
    expect(lines.at(-1)).toBe(`  crosswise cluster '${out}/config.resolved.yaml' --out '${out}' && bash '${out}/array-job.sh'`);
    expect(await clusterCommand([join(out, 'config.resolved.yaml'), '--out', out])).toBe(0);
    expect(readFileSync(join(out, 'array-job.sh'), 'utf8')).toContain('--array=1,7 ');
  });

  it('names the missing plan.csv of a folder that holds no sweep, exits 1 and writes nothing', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const { err } = capture();
    expect(await statusCommand([join(dir, 'nowhere')])).toBe(1);
    expect(err).toEqual([`crosswise status: ${join(dir, 'nowhere', 'plan.csv')}: not found (no sweep was run in this folder; run it first)`]);
    expect(existsSync(join(dir, 'nowhere'))).toBe(false);
  });
});
