import { readFile, rm } from 'node:fs/promises';
import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/build-report.js';
import { parseCsv } from '../../src/results/csv.js';
import { parseResultsCsv } from '../../src/results/results-table.js';
import { testCellId, writeRun, type TestCell } from './stored-cells.js';

const HIDDEN = 'learners.*.encoder.hidden';

// Test data: two learners, two seeds, a vary key with two values; the second combination's
// scores are the first's plus 0.1 for learner b only. Cells are in plan order.
function cells(): TestCell[] {
  const out: TestCell[] = [];
  for (const hidden of ['[64]', '[128, 64]']) {
    for (const seed of [1, 2]) {
      for (const learner of ['a', 'b']) {
        const bump = hidden === '[128, 64]' && learner === 'b' ? 0.1 : 0;
        const value = 0.5 + 0.1 * seed + (learner === 'b' ? 0.05 * seed : 0) + bump;
        out.push({ learner, objective: 'predict', rule: 'backprop', seed, vary: { [HIDDEN]: hidden }, log: [],
          rows: [{ target: 'y', channel: 'sound', kind: 'masking', severity: 0, parameter: Infinity, measure: 'score', metric: 'r2', value }] });
      }
    }
  }
  return out;
}

describe('report with vary keys', () => {
  it('writes one block of tables per combination and vary columns in comparisons.csv', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'report-vary-'));
    try {
      writeRun(dir, cells(), { name: 'vary-test', baseline: 'a', varyKeys: [HIDDEN] });
      const files = await buildReport(dir);
      const summary = await readFile(files.summaryPath, 'utf8');
      expect(summary).toContain('## Combination 1: `learners.*.encoder.hidden` = [64]');
      expect(summary).toContain('## Combination 2: `learners.*.encoder.hidden` = [128, 64]');
      expect(files.plots.map((p) => p.slice(dir.length + 1)).sort()).toEqual([
        'plots/robustness_y_sound_masking_c1.svg', 'plots/robustness_y_sound_masking_c2.svg',
      ]);
      const records = parseCsv(await readFile(files.comparisonsPath, 'utf8'), 'comparisons.csv');
      const header = records[0].fields;
      expect(header.at(-1)).toBe(HIDDEN);
      // b − a: combination 1 diffs 0.05, 0.10 → 0.075; combination 2 adds 0.1 → 0.175 (by hand).
      expect(records.slice(1).map((r) => [r.fields.at(-1), Number(r.fields[header.indexOf('mean_diff')]).toFixed(3)])).toEqual([
        ['[64]', '0.075'], ['[128, 64]', '0.175'],
      ]);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});

describe('report from the stored cells of the plan', () => {
  it('rebuilds results.csv from the planned cells alone, ignoring an old results.csv and cells of an earlier config', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'report-cells-'));
    try {
      const planned = cells();
      const stale: TestCell = { ...planned[0], learner: 'renamed-since' };
      writeRun(dir, [stale], { name: 'earlier', varyKeys: [HIDDEN] });
      writeRun(dir, planned, { name: 'cells-test', baseline: 'a', varyKeys: [HIDDEN] });
      writeFileSync(join(dir, 'results.csv'), 'not a results table\n');
      expect(readdirSync(join(dir, 'cells'))).toContain(testCellId(stale));
      const files = await buildReport(dir);
      const table = parseResultsCsv(await readFile(files.resultsPath, 'utf8'));
      // Output order: combination, then learner, then seed (planned: combination, seed, learner).
      expect(table.rows.map((r) => r.cell)).toEqual([0, 2, 1, 3, 4, 6, 5, 7].map((i) => testCellId(planned[i])));
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
