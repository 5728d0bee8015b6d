import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { EpochLog } from '../../src/learn/spec.js';
import { buildReport } from '../../src/report/build-report.js';
import { fixtureCells } from './fixture.js';
import { writeRun } from './stored-cells.js';

const dirs: string[] = [];
afterAll(async () => { await Promise.all(dirs.map((d) => rm(d, { recursive: true, force: true }))); });

// Test data: the fixture's cells with spiking activity written into their train.csv. The
// sound-from-sight learner's last layer is silent at the epoch it kept (the lowest validation
// loss) in seeds 1 and 3; in seed 2 it is silent only at an epoch it did not keep.
const firingOf = (seed: number, epoch: number) => {
  const silent = seed === 2 ? epoch === 1 : epoch === 2;
  return { rateHz: [40, silent ? 0 : 12], silentFraction: [0, silent ? 1 : 0.25] };
};

describe('the note on silent spiking layers', () => {
  it('names a learner whose last layer never spiked at its kept epoch, with those seeds only', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'silent-'));
    dirs.push(dir);
    const cells = fixtureCells().map((cell) => (cell.learner !== 'sound-from-sight' ? cell : {
      ...cell,
      log: cell.log.map((entry): EpochLog => ({ ...entry, firing: firingOf(cell.seed, entry.epoch) })),
    }));
    writeRun(dir, cells, { name: 'silent-run', baseline: 'sight-autoencoder' });
    const files = await buildReport(dir);
    const note = "learner 'sound-from-sight': the last hidden layer of its spiking encoder never spiked on the validation split (seeds 1, 3); its features are all zero, so its probes score at chance";
    expect(files.warnings.filter((w) => w.includes('spiking'))).toEqual([note]);
    const summary = await readFile(files.summaryPath, 'utf8');
    expect(summary).toContain(`## Warnings\n\n- ${note}\n`);
  });
});
