import { readFile, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/build-report.js';
import { parseCsv } from '../../src/results/csv.js';
import { configFolder, spawnWithFake } from '../experiment/helpers.js';

// The runner's own output layout, produced by `crosswise run` with the experiment tests'
// stand-in cell work (scores derived from a hash of the settings: test data, not measurements).
const CONFIG = `name: report-contract
world: world.yaml
seeds: [1, 2]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], train: { epochs: 2 } }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight], train: { epochs: 2 } }
  - { name: sight-diverge, objective: reconstruct, input: [sight], train: { epochs: 2 } }
probe: { baseline: sight-autoencoder }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 3] }
vary:
  collect.steps: [1000, 2000]
out: out
`;

describe('report on an output folder written by crosswise run', () => {
  it('reads plan.csv, config.resolved.yaml, cell.json, scores.csv and train.csv as the runner writes them', async () => {
    const dir = configFolder(CONFIG);
    try {
      await checkReport(dir);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});

async function checkReport(dir: string): Promise<void> {
  const run = await spawnWithFake(['run', join(dir, 'config.yaml'), '--jobs', '1', '--plain'], undefined, { FAKE_EPOCH_MS: '1' });
  expect(run.code).toBe(3); // the diverging learner's cells fail; the others are stored
  const out = join(dir, 'out');
  const files = await buildReport(out);
  expect(files.warnings).toEqual([]);
  const summary = await readFile(files.summaryPath, 'utf8');
  expect(summary).toContain('Baseline learner: `sight-autoencoder`.');
  expect(summary).toContain('## Combination 2: `collect.steps` = 2000');
  expect(summary).toContain('| sight-diverge | 1 | 1000 | LearnerDivergedError: loss became NaN at epoch 1 |');
  // 2 combinations × 5 default targets × (2 severities + noisy, drop and area), sound-from-sight against the baseline;
  // its noisy comparisons (2 × 5) are the primary family.
  const records = parseCsv(await readFile(files.comparisonsPath, 'utf8'), 'comparisons.csv');
  expect(records.length - 1).toBe(2 * 5 * (2 + 3));
  const family = records[0].fields.indexOf('family');
  expect(records.slice(1).filter((r) => r.fields[family] === 'primary')).toHaveLength(2 * 5);
  expect(files.plots.filter((p) => p.includes('training')).length).toBe(2);
  const written = await readFile(files.resultsPath, 'utf8');
  await writeFile(files.resultsPath, '');
  await buildReport(out);
  expect(await readFile(files.resultsPath, 'utf8')).toBe(written);
}
