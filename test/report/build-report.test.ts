import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildReport, type ReportFiles } from '../../src/report/build-report.js';
import { parseCsv } from '../../src/results/csv.js';
import { fixtureCells, writeFixture } from './fixture.js';
import { testCellId } from './stored-cells.js';

let dir = '';
let files: ReportFiles;
let failedId = '';

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'report-'));
  ({ failedId } = writeFixture(dir, { features: true }));
  files = await buildReport(dir);
});
afterAll(async () => { await rm(dir, { recursive: true, force: true }); });

describe('summary.md (from the fixture test data)', () => {
  it('holds the learner × severity table of x with mean ± 95% CI half-width', async () => {
    // sound-from-sight at severity 0: 0.9, 0.8, 0.7 → mean 0.8, sd 0.1, half-width
    // t(0.975, 2) · 0.1 / √3 = 4.3027 · 0.057735 = 0.248 (t from standard tables).
    // At severity 1: 0.8, 0.7, 0.7 → mean 0.733, sd 0.057735, half-width 0.143 (by hand).
    const text = await readFile(files.summaryPath, 'utf8');
    const lines = text.split('\n');
    const at = lines.indexOf('## x: sight gaussian noise (R²)');
    expect(lines.slice(at + 4, at + 9)).toEqual([
      '| learner | severity 0 | severity 1 |',
      '| --- | --- | --- |',
      '| sound-from-sight | 0.800 ± 0.248 (n=3) | 0.733 ± 0.143 (n=3) |',
      '| sight-autoencoder | 0.733 ± 0.143 (n=3) | 0.467 ± 0.143 (n=3) |',
      '| untrained | 0.267 ± 0.143 (n=3) | 0.133 ± 0.143 (n=3) |',
    ]);
  });

  it('shows the chance level beside a categorical target', async () => {
    const text = await readFile(files.summaryPath, 'utf8');
    expect(text).toContain('| chance (majority class) | 0.600 | 0.600 |');
  });

  it('gives one verdict line per target and noise from the primary family, hedged for few seeds', async () => {
    // sound-from-sight − sight-autoencoder noisy (= R² at severity 1, floored at 0): 0.3, 0.2, 0.3 → +0.267,
    // CI ± 4.3027 · 0.033333 = ± 0.143; clean 0.1, 0.1, 0 → +0.067 ± 0.143 (by hand, t from standard tables).
    // Holm over the primary family: wall_ahead is identical in every seed, so m = 1 and p_holm = p = 1 − 8/√66 = 0.015.
    const text = await readFile(files.summaryPath, 'utf8');
    expect(text).toContain('- x under sight gaussian noise (noisy, learner − sight-autoencoder, chance-corrected): in these runs, '
      + 'sound-from-sight kept reliably more of the world under noise than sight-autoencoder: +0.267 [+0.123, +0.410], Holm p 0.015, 3 seeds; '
      + 'clean +0.067 [-0.077, +0.210].');
    expect(text).toContain('- wall_ahead under sight gaussian noise (noisy, learner − sight-autoencoder, chance-corrected): in these runs, '
      + 'sound-from-sight − sight-autoencoder was +0.000 in every seed (identical features, or noise that changes neither): nothing to test.');
    expect(text).toContain('With 3 seeds the tests have little power; a difference that is not reliable here is not evidence that the learners are equally robust.');
  });

  it('states what the primary family can detect: 1 learner × 2 targets × 1 noise, 3 seeds (src/stats/power.ts)', async () => {
    const text = await readFile(files.summaryPath, 'utf8');
    expect(text).toMatch(/Power: the primary family has 2 hypotheses \(1 learner × 2 targets × 1 noise\)\. With 3 seeds, a two-sided paired t-test at Holm's first step \(α = 0\.05\/2\) detects d_z ≥ \d+\.\d\d with 80% power; d_z = 1 would need \d+ seeds\./);
  });

  it('never jumps a heading level', async () => {
    const levels = (await readFile(files.summaryPath, 'utf8')).split('\n').filter((l) => l.startsWith('#')).map((l) => l.indexOf(' '));
    levels.forEach((level, i) => { if (i > 0) expect(level - levels[i - 1]).toBeLessThanOrEqual(1); });
  });

  it('tabulates the weight-update angle per layer at the epoch each cell kept', async () => {
    // Validation loss 1.2, 0.9: epoch 2 is kept, where layer 1 is at 61, 62, 63 degrees → mean 62, sd 1,
    // half-width 4.3027 / √3 = 2.484 (t from standard tables).
    const text = await readFile(files.summaryPath, 'utf8');
    expect(text).toContain('| learner | epoch kept (per seed) | layer 1 (degrees) | layer 2 (degrees) |');
    expect(text).toContain('| sound-from-sight | 2, 2, 2 | 62.000 ± 2.484 (n=3) | 0.000 ± 0.000 (n=3) |');
  });

  it('lists the failed cell with its reason', async () => {
    const text = await readFile(files.summaryPath, 'utf8');
    expect(text).toContain(`| ${failedId} | sight-forecaster | 1 | loss became NaN at epoch 2 |`);
  });

  it('reports CKA between learners: 1 for a scaled copy (Kornblith et al. 2019, isotropic scaling)', async () => {
    const text = await readFile(files.summaryPath, 'utf8');
    expect(text).toContain('| untrained | 1.000 ± 0.000 (n=3) |');
  });
});

describe('comparisons.csv (from the fixture test data)', () => {
  it('holds the paired differences, t-test p and Holm p computed by hand', async () => {
    const records = parseCsv(await readFile(files.comparisonsPath, 'utf8'), 'comparisons.csv');
    const header = records[0].fields;
    expect(header).toEqual(['learner', 'baseline', 'target', 'channel', 'kind', 'severity', 'measure', 'family', 'metric',
      'mean_diff', 'ci_low', 'ci_high', 'p', 'p_holm', 'd_z', 'n_seeds']);
    const row = (learner: string, severity: string): Record<string, string> => {
      const r = records.find((x) => x.fields[0] === learner && x.fields[2] === 'x' && x.fields[5] === severity)!;
      return Object.fromEntries(header.map((h, i) => [h, r.fields[i]]));
    };
    // Student t with 2 df has the closed form P(|T| > t) = 1 − t / √(t² + 2) (Student 1908).
    const p2 = (t: number): number => 1 - Math.abs(t) / Math.sqrt(t * t + 2);
    // sound-from-sight − sight-autoencoder at severity 1: 0.3, 0.2, 0.3 → mean 0.2667,
    // sd 0.057735, se 0.033333, t = 8, d_z = 4.6188 (by hand).
    const sound = row('sound-from-sight', '1');
    expect(Number(sound.mean_diff)).toBeCloseTo(0.266667, 5);
    expect(Number(sound.p)).toBeCloseTo(p2(8), 6);
    expect(Number(sound.d_z)).toBeCloseTo(4.6188, 4);
    expect(Number(sound.ci_low)).toBeCloseTo(0.266667 - 4.3027 * 0.033333, 3);
    expect(sound.n_seeds).toBe('3');
    // Exploratory, Holm within x under sight gaussian noise over 9 hypotheses: untrained − sight-autoencoder at
    // severity 0 (−0.5, −0.4, −0.5 → t = −14) has the smallest p and gets the factor m = 9 (Holm 1979).
    expect(sound.family).toBe('exploratory');
    expect(Number(row('untrained', '0').p_holm)).toBeCloseTo(9 * p2(14), 6);
    // The primary family (noisy) holds one tested hypothesis: its Holm p is its p.
    const noisy = records.find((x) => x.fields[0] === 'sound-from-sight' && x.fields[2] === 'x' && x.fields[6] === 'noisy')!.fields;
    expect(noisy[header.indexOf('family')]).toBe('primary');
    expect(Number(noisy[header.indexOf('p_holm')])).toBeCloseTo(p2(8), 6);
    // wall_ahead is identical in every seed: family identical, and p is an empty field, never the text NaN.
    const accuracy = records.find((x) => x.fields[2] === 'wall_ahead')!.fields;
    expect(accuracy[header.indexOf('family')]).toBe('identical');
    expect(accuracy.slice(header.indexOf('p'), header.indexOf('p_holm') + 1)).toEqual(['', '']);
    expect(sound.measure).toBe('score');
  });
});

describe('plots (from the fixture test data)', () => {
  it('writes valid SVG robustness curves with one line path per learner', async () => {
    const svg = await readFile(join(dir, 'plots', 'robustness_x_sight_gaussian.svg'), 'utf8');
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg.trimEnd().endsWith('</svg>')).toBe(true);
    const lineGroups = svg.split('<g class="mark-line role-mark').slice(1);
    expect(lineGroups.length).toBe(3);
    for (const g of lineGroups) expect(g.slice(0, g.indexOf('</g>')).match(/<path /g)?.length).toBe(1);
    expect(svg.split('<g class="mark-area role-mark').length - 1).toBe(3);
  });

  it('removes its own plots from an earlier report that this one no longer draws, and nothing else', async () => {
    await writeFile(join(dir, 'plots', 'robustness_gone_sight_gaussian.svg'), '<svg/>');
    await writeFile(join(dir, 'plots', 'my-notes.svg'), '<svg/>');
    await buildReport(dir);
    const names = await readdir(join(dir, 'plots'));
    expect(names).not.toContain('robustness_gone_sight_gaussian.svg');
    expect(names).toContain('my-notes.svg');
    await rm(join(dir, 'plots', 'my-notes.svg'));
  });

  it('writes the training curves and nothing half-written', async () => {
    expect((await readdir(join(dir, 'plots'))).sort()).toEqual([
      'robustness_wall_ahead_sight_gaussian.svg', 'robustness_x_sight_gaussian.svg', 'training.svg',
    ]);
    expect(files.plots.length).toBe(3);
    expect((await readdir(dir)).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
});

describe('buildReport errors', () => {
  it('fails on a folder where no sweep ran with a one-line error naming the file', async () => {
    const empty = await mkdtemp(join(tmpdir(), 'report-empty-'));
    try {
      await expect(buildReport(empty)).rejects.toThrow(`${join(empty, 'plan.csv')}: not found (no sweep was run in this folder; run it first)`);
      expect(await readdir(empty)).toEqual([]);
    } finally {
      await rm(empty, { recursive: true, force: true });
    }
  });
});

describe('buildReport with damaged cell files', () => {
  it('warns about a bad train.csv and a bad cell.json, naming the file, and still reports', async () => {
    const damaged = await mkdtemp(join(tmpdir(), 'report-damaged-'));
    try {
      writeFixture(damaged);
      const [one, two] = fixtureCells().filter((c) => c.learner === 'untrained').map(testCellId);
      await writeFile(join(damaged, 'cells', one, 'train.csv'), 'epoch,train_loss,validation_loss,seconds\nfirst,1,1,1\n');
      await writeFile(join(damaged, 'cells', two, 'cell.json'), '{ not json');
      const report = await buildReport(damaged);
      expect(report.warnings).toContain(`${join(damaged, 'cells', one, 'train.csv')}:2: epoch: expected 1, got 'first' (training curve left out)`);
      expect(report.warnings.some((w) => w.startsWith(`${join(damaged, 'cells', two, 'cell.json')}: not valid JSON`))).toBe(true);
      expect(await readFile(report.summaryPath, 'utf8')).toContain('## Warnings');
    } finally {
      await rm(damaged, { recursive: true, force: true });
    }
  });
});
