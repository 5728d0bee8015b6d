import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { parse, stringify } from 'yaml';
import { main } from '../../src/cli.js';
import { checkConfigFile } from '../../src/experiment/config.js';
import { parseResultsCsv, type ResultRow } from '../../src/results/results-table.js';
import { capture } from './cluster-helpers.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const crosswise = (...args: string[]) => promisify(execFile)(process.execPath, [join(ROOT, 'bin/crosswise.js'), ...args], { cwd: ROOT });

let out: string[];
let err: string[];
beforeEach(() => ({ out, err } = capture()));
afterEach(() => vi.restoreAllMocks());

describe('crosswise new', () => {
  it('writes a plug-in file and a config that uses it, which check accepts as they are', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-new-'));
    for (const kind of ['objective', 'rule', 'policy', 'noise']) {
      expect(await main(['new', kind, `my-${kind}`, '--dir', dir])).toBe(0);
      expect(checkConfigFile(join(dir, `my-${kind}.yaml`))).toEqual([]);
    }
    expect(readdirSync(dir).sort()).toEqual(['my-noise.ts', 'my-noise.yaml', 'my-objective.ts', 'my-objective.yaml', 'my-policy.ts', 'my-policy.yaml', 'my-rule.ts', 'my-rule.yaml']);
    expect(out[0]).toBe(`wrote ${join(dir, 'my-objective.ts')} (an objective plug-in that runs as it is) and ${join(dir, 'my-objective.yaml')} (a sweep using it)`);
    expect(readFileSync(join(dir, 'my-rule.yaml'), 'utf8')).toContain('    rule: ./my-rule.ts');
  });

  it('refuses to overwrite, a built-in name, and an unknown kind, writing nothing', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-new-'));
    writeFileSync(join(dir, 'mine.yaml'), 'mine');
    expect(await main(['new', 'rule', 'mine', '--dir', dir])).toBe(1);
    expect(await main(['new', 'rule', 'sign-symmetry', '--dir', dir])).toBe(1);
    expect(await main(['new', 'rules', 'other', '--dir', dir])).toBe(1);
    expect(err).toEqual([
      `crosswise new: ${join(dir, 'mine.ts')} already exists; choose another name or move it away (nothing was written)`.replace('mine.ts', 'mine.yaml'),
      "crosswise new: <name>: 'sign-symmetry' is a built-in rule; give the plug-in another name",
      "crosswise new: <kind>: expected one of objective | rule | policy | noise, got 'rules' (did you mean 'rule'?)",
    ]);
    expect(readdirSync(dir)).toEqual(['mine.yaml']);
    expect(readFileSync(join(dir, 'mine.yaml'), 'utf8')).toBe('mine');
  });
});

/** The starter config cut down to one seed, 800 steps and 2 epochs of a small encoder, so a test can run it. */
function cutDown(path: string): void {
  const config = parse(readFileSync(path, 'utf8')) as { seeds: number[]; collect: Record<string, unknown>; learners: Record<string, unknown>[] };
  config.seeds = [1];
  config.collect = { ...config.collect, steps: 800, episode_steps: 50 };
  for (const learner of config.learners) Object.assign(learner, { encoder: { hidden: [8] }, train: { epochs: 2, batch: 64 } });
  writeFileSync(path, stringify(config));
}

function results(dir: string, name: string): readonly ResultRow[] {
  return parseResultsCsv(readFileSync(join(dir, 'runs', name, 'results.csv'), 'utf8')).rows;
}

const measured = (rows: readonly ResultRow[]) => rows.map((r) => [r.target, r.kind, r.severity, r.metric, r.value].join(','));

describe('the starters crosswise new writes', () => {
  it('run as they are, beside the built-ins their configs name', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-new-run-'));
    for (const kind of ['objective', 'rule', 'policy', 'noise']) {
      expect(await main(['new', kind, `my-${kind}`, '--dir', dir])).toBe(0);
      cutDown(join(dir, `my-${kind}.yaml`));
    }
    const runs = await Promise.all(['objective', 'rule', 'policy', 'noise'].map((kind) => crosswise('run', join(dir, `my-${kind}.yaml`), '--plain')));
    expect(runs.map((r) => r.stdout.match(/sweep done: \d+ done, \d+ failed/)?.[0])).toEqual([
      'sweep done: 3 done, 0 failed', 'sweep done: 3 done, 0 failed', 'sweep done: 4 done, 0 failed', 'sweep done: 2 done, 0 failed',
    ]);
    // The rule starter is feedback alignment spelled out (its comment says so): the same numbers.
    const rule = results(dir, 'my-rule');
    expect(measured(rule.filter((r) => r.learner === 'my-rule'))).toEqual(measured(rule.filter((r) => r.learner === 'feedback-alignment')));
    // The objective starter trains (its own name in the objective column), the noise starter scores rows of its kind.
    expect(new Set(results(dir, 'my-objective').map((r) => r.objective))).toEqual(new Set(['my-objective', 'predict', 'reconstruct']));
    expect(results(dir, 'my-noise').filter((r) => r.kind === 'my-noise' && r.severity === 4).length).toBeGreaterThan(0);
    expect(existsSync(join(dir, 'runs', 'my-policy', 'summary.md'))).toBe(true);
  }, 600_000); // four small sweeps at once on a busy machine
});
