import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, it } from 'vitest';
import { parse, stringify } from 'yaml';
import signConcordant from '../../configs/plugins/sign-concordant.js';
import targetChange from '../../configs/plugins/target-change.js';
import { initBackend } from '../../src/learn/backend.js';
import { bindObjective, splitExamples } from '../../src/learn/bound-objective.js';
import { TrainingStatistics } from '../../src/learn/examples.js';
import { feedbackAlignment } from '../../src/learn/learning-rules.js';
import { disposeTower } from '../../src/learn/network.js';
import type { RuleDefinition } from '../../src/learn/rule-definition.js';
import { trainNetwork } from '../../src/learn/trainer.js';
import { parseResultsCsv } from '../../src/results/results-table.js';
import { episodeSplit, learnerSpec, syntheticDataset } from '../learn/synthetic.js';

// The example plug-ins of configs/plugins/: what each computes, checked by hand, and each
// config run end to end on a tiny sweep by the built CLI.

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const EXAMPLES = join(ROOT, 'configs/plugins');
const crosswise = (...args: string[]) => promisify(execFile)(process.execPath, [join(ROOT, 'bin/crosswise.js'), ...args], { cwd: ROOT });

beforeAll(() => initBackend('wasm'));

/** An example config cut down to one seed, 800 steps and 2 epochs, with its paths made absolute, in a fresh folder. */
function tinyCopy(name: string): string {
  const config = parse(readFileSync(join(EXAMPLES, `${name}.yaml`), 'utf8')) as Record<string, unknown> & { learners: Record<string, unknown>[]; collect: object };
  const absolute = (value: unknown) => (typeof value === 'string' && value.endsWith('.ts') ? resolve(EXAMPLES, value) : value);
  const dir = mkdtempSync(join(tmpdir(), `crosswise-${name}-`));
  Object.assign(config, { world: resolve(EXAMPLES, config.world as string), seeds: [1], out: join(dir, 'out') });
  config.collect = { ...config.collect, steps: 800, episode_steps: 50 };
  for (const learner of config.learners) {
    Object.assign(learner, { objective: absolute(learner.objective), rule: absolute(learner.rule), encoder: { hidden: [8] }, train: { epochs: 2, batch: 64 } });
  }
  writeFileSync(join(dir, 'config.yaml'), stringify(config));
  return dir;
}

describe('configs/plugins/target-change.ts', () => {
  it('pairs step t\'s input and the action into t + 1 with the standardised change of the target', () => {
    const data = syntheticDataset(300);
    const split = episodeSplit(data);
    const spec = learnerSpec({ objective: 'target-change', input: ['sight'], target: ['sound'] });
    const objective = bindObjective(targetChange, spec, data);
    expect(objective.towers.map((t) => [t.inputWidth, t.outputWidth, t.extraWidth])).toEqual([[12, 6, 5]]);
    const stats = new TrainingStatistics(data, split.train);
    const steps = split.train.subarray(0, 80);
    const e = splitExamples(objective, stats, steps);
    const rows = steps.filter((t) => data.hasNext[t] === 1);
    expect(e.n).toBe(rows.length);
    // By hand: (sound(t + 1) − mean) / std − (sound(t) − mean) / std, with training-split statistics.
    const { mean, std } = stats.channels(['sound']);
    rows.forEach((t, i) => {
      for (let j = 0; j < 6; j++) {
        const expected = (data.channels.sound[(t + 1) * 6 + j] - mean[j]) / std[j] - (data.channels.sound[t * 6 + j] - mean[j]) / std[j];
        expect(e.target!.data[i * 6 + j]).toBeCloseTo(expected, 5);
      }
      expect(Array.from(e.extra!.data.subarray(i * 5, i * 5 + 5))).toEqual(Array.from(data.channels.motor.subarray((t + 1) * 5, (t + 2) * 5)));
    });
  });

  it('runs end to end on a tiny sweep beside the built-ins, under its own name', async () => {
    const dir = tinyCopy('target-change');
    const { stdout } = await crosswise('run', join(dir, 'config.yaml'), '--jobs', '2', '--plain');
    expect(stdout).toContain('sweep done: 3 done, 0 failed');
    const rows = parseResultsCsv(readFileSync(join(dir, 'out', 'results.csv'), 'utf8')).rows;
    expect([...new Set(rows.map((r) => `${r.learner}:${r.objective}`))]).toEqual(['sound-change-from-sight:target-change', 'sound-from-sight:predict', 'sight-autoencoder:reconstruct']);
  }, 600_000); // a CLI sweep on a busy machine
});

describe('configs/plugins/sign-concordant.ts', () => {
  it('sends the error through sign(W) times the magnitudes of feedback alignment\'s matrices, at every step', async () => {
    // Liao, Leibo & Poggio 2016 (from memory): feedback with the forward weights' signs and
    // fixed random magnitudes. Its |R| come from the stream feedback alignment draws B from.
    const data = syntheticDataset(400);
    let steps = 0;
    const watched: RuleDefinition = {
      ...signConcordant,
      deltas: (step) => signConcordant.deltas({
        ...step,
        chain: (matrices) => {
          steps += 1;
          matrices.forEach((M, l) => {
            const W = step.weights[l + 1].dataSync();
            const R = step.state[l].dataSync();
            expect(Array.from(M.dataSync())).toEqual(Array.from(W, (w, i) => Math.fround(Math.sign(w) * R[i])));
          });
          return step.chain(matrices);
        },
      }),
    };
    const first: number[][] = [];
    const fa: RuleDefinition = { ...feedbackAlignment, deltas: (step) => { if (first.length === 0) first.push(...step.state.map((B) => Array.from(B.dataSync(), Math.abs))); return feedbackAlignment.deltas(step); } };
    const magnitudes: number[][] = [];
    const own: RuleDefinition = { ...watched, deltas: (step) => { if (magnitudes.length === 0) magnitudes.push(...step.state.map((R) => Array.from(R.dataSync()))); return watched.deltas(step); } };
    const spec = learnerSpec({ train: { epochs: 2 } });
    for (const rule of [own, fa]) (await trainNetwork(spec, data, episodeSplit(data), { seed: 4, rule })).towers.forEach(disposeTower);
    expect(steps).toBeGreaterThan(10);
    expect(magnitudes).toEqual(first);
  });

  it('runs end to end on a tiny sweep beside the built-in rules, with its update/gradient angles recorded', async () => {
    const dir = tinyCopy('sign-concordant');
    const { stdout } = await crosswise('run', join(dir, 'config.yaml'), '--jobs', '2', '--plain');
    expect(stdout).toContain('sweep done: 4 done, 0 failed');
    expect(stdout).toMatch(/sign-concordant seed 1 \(\w+\) epoch 2 .* alignment \d+\.\d° \d+\.\d°/);
    const rows = parseResultsCsv(readFileSync(join(dir, 'out', 'results.csv'), 'utf8')).rows;
    expect([...new Set(rows.map((r) => r.rule))]).toEqual(['backprop', 'sign-concordant', 'sign-symmetry', 'feedback-alignment']);
  }, 600_000);
});
