import { cpSync, mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/build-report.js';
import { parseResultsCsv } from '../../src/results/results-table.js';
import { configFolder, spawnWithFake } from '../experiment/helpers.js';

// A sweep whose config order is not alphabetical and whose cells finish out of plan
// order (zeta trains longest), run with the experiment tests' stand-in cell work
// (scores derived from a hash of the settings: test data, not measurements).
const CONFIG = `name: ordering
world: world.yaml
seeds: [3, 1]
learners:
  - { name: zeta, objective: predict, input: [sight], target: [sound], train: { epochs: 4 } }
  - { name: alpha, objective: reconstruct, input: [sight], train: { epochs: 1 } }
  - { name: mid, objective: reconstruct, input: [sight], train: { epochs: 2 } }
probe: { targets: [heading, wall_ahead], baseline: alpha }
noise:
  - { channel: sound, kind: masking, severities: [0, 1] }
  - { channel: sight, kind: gaussian, severities: [0, 3] }
out: out
`;

/** Every file the report writes, by path relative to the output folder. */
function reportFiles(out: string): Map<string, Buffer> {
  const names = ['results.csv', 'summary.md', 'comparisons.csv', ...readdirSync(join(out, 'plots')).map((p) => `plots/${p}`)];
  return new Map(names.map((name) => [name, readFileSync(join(out, name))]));
}

let dir = '';
let out = '';
let byRun = new Map<string, Buffer>();

beforeAll(async () => {
  dir = configFolder(CONFIG);
  out = join(dir, 'out');
  const run = await spawnWithFake(['run', join(dir, 'config.yaml'), '--jobs', '2', '--plain']);
  expect(run.code).toBe(0);
  byRun = reportFiles(out);
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('crosswise run and crosswise report', () => {
  it('write results.csv, summary.md, comparisons.csv and the plots byte for byte the same', async () => {
    for (const name of byRun.keys()) rmSync(join(out, name));
    await buildReport(out);
    expect(reportFiles(out)).toEqual(byRun);
    expect([...byRun.keys()].filter((name) => name.startsWith('plots/'))).toHaveLength(5); // 2 targets × 2 noises + training
  });

  it('give the same files from cells stored in another order', async () => {
    const scrambled = join(dir, 'scrambled');
    mkdirSync(join(scrambled, 'cells'), { recursive: true });
    for (const file of ['config.resolved.yaml', 'plan.csv', 'experiment.json']) cpSync(join(out, file), join(scrambled, file));
    const cells = readdirSync(join(out, 'cells')).sort();
    // Stored in a fixed permutation of the sorted ids: odd positions first, then even ones reversed.
    const order = [...cells.filter((_, i) => i % 2 === 1), ...cells.filter((_, i) => i % 2 === 0).reverse()];
    for (const id of order) cpSync(join(out, 'cells', id), join(scrambled, 'cells', id), { recursive: true });
    await buildReport(scrambled);
    expect(reportFiles(scrambled)).toEqual(byRun);
  });

  it('list rows in config order: learners, seeds, targets, noises, severities', () => {
    const { rows } = parseResultsCsv(byRun.get('results.csv')!.toString('utf8'));
    const distinct = (values: readonly string[]) => values.filter((v, i) => values.indexOf(v) === i);
    expect(distinct(rows.map((r) => r.learner))).toEqual(['zeta', 'alpha', 'mid']);
    const scores = rows.filter((r) => r.measure === 'score');
    expect(scores.slice(0, 8).map((r) => `${r.seed} ${r.target} ${r.channel} ${r.severity} ${r.parameter}`)).toEqual([
      '3 heading sound 0 Infinity', '3 heading sound 1 20', '3 heading sight 0 0', '3 heading sight 3 1',
      '3 wall_ahead sound 0 Infinity', '3 wall_ahead sound 1 20', '3 wall_ahead sight 0 0', '3 wall_ahead sight 3 1',
    ]);
    expect(scores[8].seed).toBe(1);
  });

  it('order the summary and comparisons by the config, not by which cell finished first', () => {
    const summary = byRun.get('summary.md')!.toString('utf8');
    const table = summary.slice(summary.indexOf('## heading: sound masking noise'));
    expect(table.indexOf('| zeta |')).toBeLessThan(table.indexOf('| alpha |'));
    expect(table.indexOf('| alpha |')).toBeLessThan(table.indexOf('| mid |'));
    expect(summary).not.toContain('Rebuilt by');
    const learners = byRun.get('comparisons.csv')!.toString('utf8').trim().split('\n').slice(1).map((line) => line.split(',')[0]);
    expect(learners.filter((l, i) => learners.indexOf(l) === i)).toEqual(['zeta', 'mid']);
  });
});
