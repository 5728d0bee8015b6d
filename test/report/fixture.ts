import type { EpochLog } from '../../src/learn/spec.js';
import { correctedScore, seedRobustness, SEED_MEASURES } from '../../src/probe/robustness.js';
import type { Measurement } from '../../src/results/results-table.js';
import { testCellId, writeRun, type TestCell } from './stored-cells.js';

/**
 * Test data (invented, not measurements): three learners, three seeds, one continuous
 * and one categorical target, sight gaussian noise at severities 0 and 1, CKA rows,
 * train.csv per cell, one failed cell. Scores are chosen so hand arithmetic is easy.
 */
export const SCORES: Readonly<Record<string, Readonly<Record<number, readonly [number, number]>>>> = {
  // learner → seed → [x R² at severity 0, at severity 1]
  'sound-from-sight': { 1: [0.9, 0.8], 2: [0.8, 0.7], 3: [0.7, 0.7] },
  'sight-autoencoder': { 1: [0.8, 0.5], 2: [0.7, 0.5], 3: [0.7, 0.4] },
  untrained: { 1: [0.3, 0.1], 2: [0.3, 0.2], 3: [0.2, 0.1] },
};

const META: Readonly<Record<string, Pick<TestCell, 'objective' | 'rule'>>> = {
  'sound-from-sight': { objective: 'predict', rule: 'feedback-alignment' },
  'sight-autoencoder': { objective: 'reconstruct', rule: 'backprop' },
  untrained: { objective: 'untrained', rule: 'backprop' },
};

const epoch = (n: number, trainLoss: number, validationLoss: number, alignmentDeg: number[] = []): EpochLog =>
  ({ epoch: n, trainLoss, validationLoss, seconds: 0.1, alignmentDeg });

function measurements(learner: string, seed: number): Measurement[] {
  return [...scores(learner, seed), ...seedMeasures(learner, seed)];
}

/** noisy, drop and area of each target as the cell computes them (src/probe/robustness.ts), chance 0.6 for wall_ahead. */
function seedMeasures(learner: string, seed: number): Measurement[] {
  const curves = {
    x: { metric: 'r2', chance: NaN, values: SCORES[learner][seed] },
    wall_ahead: { metric: 'accuracy', chance: 0.6, values: [0, 1].map((severity) => 0.9 - 0.1 * severity - 0.01 * seed) },
  } as const;
  return Object.entries(curves).flatMap(([target, { metric, chance, values }]) => {
    const figures = seedRobustness(values.map((score, severity) => ({ severity, score: correctedScore(metric, score, chance) })));
    return SEED_MEASURES.map((measure): Measurement => ({
      target, channel: 'sight', kind: 'gaussian', severity: null, parameter: null, measure, metric, value: figures[measure].value,
    }));
  });
}

function scores(learner: string, seed: number): Measurement[] {
  return [0, 1].flatMap((severity): Measurement[] => {
    const at = { channel: 'sight', kind: 'gaussian', severity, parameter: [0, 0.25][severity], measure: 'score' } as const; // σ from the severity table
    return [
      { ...at, target: 'x', metric: 'r2', value: SCORES[learner][seed][severity] },
      { ...at, target: 'wall_ahead', metric: 'accuracy', value: 0.9 - 0.1 * severity - 0.01 * seed },
      { ...at, target: 'wall_ahead', metric: 'chance', value: 0.6 },
      { ...at, target: '-', metric: 'cka', value: 1 - 0.2 * severity },
    ];
  });
}

/** The fixture's cells in plan order (seeds, then learners); the forecaster's one cell failed. */
export function fixtureCells(options: { features?: boolean } = {}): TestCell[] {
  const cells: TestCell[] = [];
  for (const seed of [1, 2, 3]) {
    for (const learner of Object.keys(SCORES)) {
      const fa = META[learner].rule === 'feedback-alignment';
      // Feedback alignment's layer 1 ends at 60 + seed degrees, layer 2 at 0.
      const log = fa ? [epoch(1, 1, 1.2, [89, 0]), epoch(2, 0.8, 0.9, [60 + seed, 0])] : [epoch(1, 1, 1.2), epoch(2, 0.8, 0.9), epoch(3, 0.7, 0.8)];
      // [4 rows, 2 features]: every learner sees the same rows; untrained is a scaled copy (CKA 1).
      const f = learner === 'sight-autoencoder' ? [1, 0, 0, 1, 1, 1, 2, 0] : [1, 2, 3, 4, 5, 6, 7, 9];
      const testFeatures = options.features === true ? { data: Float32Array.from(f, (v) => (learner === 'untrained' ? 3 * v : v)), shape: [4, 2] } : undefined;
      cells.push({ learner, ...META[learner], seed, rows: measurements(learner, seed), log, ...(testFeatures == null ? {} : { testFeatures }) });
    }
    if (seed === 1) cells.push({ learner: 'sight-forecaster', objective: 'forecast', rule: 'backprop', seed, reason: 'loss became NaN at epoch 2', rows: [], log: [epoch(1, 1, 1.1)] });
  }
  return cells;
}

/** Writes the fixture output folder; returns the id of its failed cell. */
export function writeFixture(dir: string, options: { features?: boolean } = {}): { failedId: string } {
  const cells = fixtureCells(options);
  writeRun(dir, cells, { name: 'fixture-run', baseline: 'sight-autoencoder' });
  return { failedId: testCellId(cells.find((c) => c.reason != null) as TestCell) };
}
