import { mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/build-report.js';
import { parseCsv } from '../../src/results/csv.js';
import { formatResultsCsv, type ResultRow } from '../../src/results/results-table.js';

// Test data: two learners, two seeds, a vary key with two values; the second combination's
// scores are the first's plus 0.1 for learner b only.
function rows(): ResultRow[] {
  const out: ResultRow[] = [];
  for (const hidden of ['[64]', '[128, 64]']) {
    for (const learner of ['a', 'b']) {
      for (const seed of [1, 2]) {
        const bump = hidden === '[128, 64]' && learner === 'b' ? 0.1 : 0;
        out.push({ cell: `${learner}${seed}${hidden.length}`, learner, objective: 'predict', rule: 'backprop', seed, target: 'y',
          channel: 'sound', kind: 'masking', severity: 0, parameter: Infinity, measure: 'score', metric: 'r2', value: 0.5 + 0.1 * seed + (learner === 'b' ? 0.05 * seed : 0) + bump,
          vary: { 'learners.*.encoder.hidden': hidden } });
      }
    }
  }
  return out;
}

describe('report with vary keys', () => {
  it('writes one block of tables per combination and vary columns in comparisons.csv', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'report-vary-'));
    try {
      await writeFile(join(dir, 'results.csv'), formatResultsCsv(rows(), ['learners.*.encoder.hidden']));
      await writeFile(join(dir, 'config.resolved.yaml'), 'name: vary-test\nprobe: { baseline: a }\n');
      const files = await buildReport(dir);
      const summary = await readFile(files.summaryPath, 'utf8');
      expect(summary).toContain('## Combination 1: `learners.*.encoder.hidden` = [64]');
      expect(summary).toContain('## Combination 2: `learners.*.encoder.hidden` = [128, 64]');
      expect(files.plots.map((p) => p.slice(dir.length + 1)).sort()).toEqual([
        'plots/robustness_y_sound_masking_c1.svg', 'plots/robustness_y_sound_masking_c2.svg',
      ]);
      const records = parseCsv(await readFile(files.comparisonsPath, 'utf8'), 'comparisons.csv');
      expect(records[0].fields.at(-1)).toBe('learners.*.encoder.hidden');
      // b − a: combination 1 diffs 0.05, 0.10 → 0.075; combination 2 adds 0.1 → 0.175 (by hand).
      expect(records.slice(1).map((r) => [r.fields.at(-1), Number(r.fields[7]).toFixed(3)])).toEqual([
        ['[64]', '0.075'], ['[128, 64]', '0.175'],
      ]);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});

describe('report from per-cell results', () => {
  it('reads the scores.csv file of every cell when there is no top-level results.csv', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'report-cells-'));
    try {
      const all = rows();
      for (const cell of new Set(all.map((r) => r.cell))) {
        await mkdir(join(dir, 'cells', cell), { recursive: true });
        await writeFile(join(dir, 'cells', cell, 'scores.csv'),
          formatResultsCsv(all.filter((r) => r.cell === cell), ['learners.*.encoder.hidden']));
      }
      await writeFile(join(dir, 'config.resolved.yaml'), 'name: cells-test\nprobe: { baseline: a }\n');
      const files = await buildReport(dir);
      const records = parseCsv(await readFile(files.comparisonsPath, 'utf8'), 'comparisons.csv');
      expect(records.length).toBe(3);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
