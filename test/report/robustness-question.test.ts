// The robustness question end to end on the real pipeline (collect, train, probe) with tiny
// settings: a null (two identical learners), a planted difference (a learner that does not
// read the noisy channel) and a control (an untrained learner whose input carries nothing).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { cellWork } from '../../src/experiment/cell-pipeline.js';
import { loadSweep } from '../../src/experiment/config.js';
import { planCells, type PlannedCell } from '../../src/experiment/plan.js';
import { preparedCka, prepareCka } from '../../src/probe/cka.js';
import { compareWithBaseline, isReliable, type Comparison } from '../../src/report/comparisons.js';
import { combinations } from '../../src/report/groups.js';
import { isScore, isSeedMeasure, type MeasureRow, type ResultRow } from '../../src/results/results-table.js';

const WORLD = fileURLToPath(new URL('../../worlds/greenhouse.yaml', import.meta.url));
const TINY = '{ hidden: [16] }';
const TRAIN = '{ epochs: 2, batch: 64 }';

interface Outcome {
  readonly rows: ResultRow[];
  readonly features: Map<string, Float32Array>; // `${learner}/${seed}` → clean test features
  readonly featureShape: Map<string, readonly number[]>;
  readonly comparisons: Comparison[];
}

/** Runs every cell of a config in this process and compares the learners as the report does. */
async function runConfig(body: string): Promise<Outcome> {
  const dir = mkdtempSync(join(tmpdir(), 'crosswise-question-'));
  writeFileSync(join(dir, 'config.yaml'), `name: question\nworld: ${WORLD}\ncollect: { steps: 1200, episode_steps: 100 }\n${body}`);
  const sweep = loadSweep(join(dir, 'config.yaml'));
  const rows: ResultRow[] = [];
  const features = new Map<string, Float32Array>();
  const featureShape = new Map<string, readonly number[]>();
  for (const cell of planCells(sweep)) {
    const outcome = await cellWork(cell, () => undefined);
    rows.push(...outcome.rows.map((m) => ({ ...m, ...columns(cell) })));
    features.set(`${cell.learner.name}/${cell.seed}`, outcome.arrays.test_features.data);
    featureShape.set(`${cell.learner.name}/${cell.seed}`, outcome.arrays.test_features.shape);
  }
  const { settings } = sweep.combinations[0];
  const controls = new Set(settings.learners.filter((l) => l.control).map((l) => l.spec.name));
  const combos = combinations(rows.filter(isScore), [], rows.filter(isSeedMeasure));
  return { rows, features, featureShape, comparisons: compareWithBaseline(combos, { baseline: settings.probe.baseline, primary: settings.probe.primary, controls }) };
}

function columns(cell: PlannedCell) {
  return { cell: cell.id, learner: cell.learner.name, objective: cell.learner.objective, rule: cell.learner.rule, seed: cell.seed, vary: {} };
}

const measuresOf = (rows: readonly ResultRow[], learner: string, target: string, measure: MeasureRow['measure']): number[] =>
  rows.filter(isSeedMeasure).filter((r) => r.learner === learner && r.target === target && r.measure === measure).map((r) => r.value);

describe('null: two identical learners under different names', () => {
  let run: Outcome;
  beforeAll(async () => {
    run = await runConfig(`seeds: [1, 2, 3]
learners:
  - { name: first-name, objective: reconstruct, input: [sight], encoder: ${TINY}, train: ${TRAIN} }
  - { name: second-name, objective: reconstruct, input: [sight], encoder: ${TINY}, train: ${TRAIN} }
probe: { targets: [wall_ahead, nearest_distance_m], baseline: first-name }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 4] }
  - { channel: sound, kind: masking, severities: [0, 3] }
`);
  }, 600_000);

  it('give identical features, so linear CKA between them is 1 (Kornblith et al. 2019: CKA(X, X) = 1)', () => {
    for (const seed of [1, 2, 3]) {
      const a = run.features.get(`first-name/${seed}`)!;
      const b = run.features.get(`second-name/${seed}`)!;
      expect(Array.from(b)).toEqual(Array.from(a));
      const [n, d] = run.featureShape.get(`first-name/${seed}`)!;
      expect(preparedCka(prepareCka(a, n, d), prepareCka(b, n, d))).toBeCloseTo(1, 12);
    }
  });

  it('put every comparison, in every measure and at every severity, in the family identical with no p', () => {
    expect(run.comparisons.length).toBeGreaterThan(0);
    expect(new Set(run.comparisons.map((c) => c.measure))).toEqual(new Set(['score', 'noisy', 'drop', 'area']));
    for (const c of run.comparisons) {
      expect(c.family).toBe('identical');
      expect(c.meanDiff).toBe(0);
      expect(c.p).toBeNaN();
      expect(isReliable(c)).toBe(false);
    }
  });
});

describe('planted: a learner reading only sound against one reading only sight, under sight noise, with a control', () => {
  let run: Outcome;
  beforeAll(async () => {
    run = await runConfig(`seeds: [1, 2, 3, 4, 5]
learners:
  - { name: sound-only, objective: reconstruct, input: [sound], encoder: ${TINY}, train: ${TRAIN} }
  - { name: sight-only, objective: reconstruct, input: [sight], encoder: ${TINY}, train: ${TRAIN} }
  - { name: motor-floor, objective: untrained, input: [motor], encoder: ${TINY} }
probe: { targets: [material_ahead, heading], baseline: sight-only }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 4, 5] }
`);
  }, 600_000);

  it('gives the sound reader a smaller drop and a larger noisy score than the sight reader in every seed', () => {
    const target = 'material_ahead';
    const soundDrop = measuresOf(run.rows, 'sound-only', target, 'drop');
    const sightDrop = measuresOf(run.rows, 'sight-only', target, 'drop');
    const soundNoisy = measuresOf(run.rows, 'sound-only', target, 'noisy');
    const sightNoisy = measuresOf(run.rows, 'sight-only', target, 'noisy');
    expect(soundDrop).toEqual([0, 0, 0, 0, 0]); // sight noise never reaches a sound encoder
    soundDrop.forEach((drop, i) => expect(drop).toBeLessThan(sightDrop[i]));
    soundNoisy.forEach((noisy, i) => expect(noisy).toBeGreaterThan(sightNoisy[i]));
  });

  it('finds the planted difference in the primary family: Holm p < 0.01 with 5 seeds (paired t, Student 1908; Holm 1979)', () => {
    const noisy = run.comparisons.find((c) => c.learner === 'sound-only' && c.target === 'material_ahead' && c.measure === 'noisy')!;
    expect(noisy.family).toBe('primary');
    expect(noisy.n).toBe(5);
    expect(noisy.pHolm).toBeLessThan(0.01);
    expect(noisy.meanDiff).toBeGreaterThan(0);
    const drop = run.comparisons.find((c) => c.learner === 'sound-only' && c.target === 'material_ahead' && c.measure === 'drop')!;
    expect(drop.family).toBe('exploratory');
    expect(drop.pHolm).toBeLessThan(0.01);
    expect(drop.meanDiff).toBeLessThan(0);
  });

  it('keeps an untrained control at chance near 0 on the corrected scale (Cohen 1960: kappa is 0 at chance), never sturdier than the baseline', () => {
    // The efference copy of the last action says nothing about which way the agent faces under a wandering policy.
    const noisy = measuresOf(run.rows, 'motor-floor', 'heading', 'noisy');
    for (const value of noisy) expect(value).toBeLessThan(0.1);
    const c = run.comparisons.find((x) => x.learner === 'motor-floor' && x.target === 'heading' && x.measure === 'noisy')!;
    expect(c.family).not.toBe('primary');
    expect(isReliable(c) && c.meanDiff > 0).toBe(false);
    // Sight noise does not reach its motor input, so it loses nothing: drop alone would flatter it.
    expect(measuresOf(run.rows, 'motor-floor', 'heading', 'drop')).toEqual([0, 0, 0, 0, 0]);
  });
});
