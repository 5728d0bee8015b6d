// Writes output folders for report tests through the one results contract (src/results/),
// as `crosswise run` would: cells/<id>/ with cell.json, train.csv and scores.csv, plan.csv,
// experiment.json and config.resolved.yaml. The numbers are test data, not measurements.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { EpochLog, LearnerSpec } from '../../src/learn/spec.js';
import type { NoiseSpec } from '../../src/noise/spec.js';
import { commitCell } from '../../src/results/cell-folder.js';
import { cellId, cellIdentity } from '../../src/results/cell-identity.js';
import type { CellRecord } from '../../src/results/cell-record.js';
import { armIdentity, armKey, formatExperimentRecord } from '../../src/results/experiment-record.js';
import { RESULTS_FORMAT_VERSION } from '../../src/results/format-version.js';
import { encodeNpy, type NpyArray } from '../../src/results/npy.js';
import { formatPlanCsv } from '../../src/results/plan-table.js';
import { formatResultsCsv, type Measurement } from '../../src/results/results-table.js';
import { formatTrainCsv } from '../../src/results/train-table.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';

/** One cell to store. */
export interface TestCell {
  readonly learner: string;
  readonly objective: LearnerSpec['objective'];
  readonly rule: LearnerSpec['rule'];
  readonly seed: number;
  readonly vary?: Readonly<Record<string, string>>;
  /** A failure reason makes the cell failed (no scores are stored). */
  readonly reason?: string;
  readonly rows: readonly Measurement[];
  readonly log: readonly EpochLog[];
  readonly testFeatures?: NpyArray;
}

/** The settings every test cell shares besides its learner, seed and vary values. */
const NOISE: NoiseSpec[] = [{ channel: 'sight', kind: 'gaussian', severities: [0, 1] }];

function learnerSpec(cell: TestCell): LearnerSpec {
  return {
    name: cell.learner, objective: cell.objective, input: ['sight'], target: cell.objective === 'predict' ? ['sound'] : [], offset: 0,
    supervisedTargets: [], encoder: { hidden: [2], activation: 'relu' }, rule: cell.rule,
    train: { optimizer: 'adam', learningRate: 0.001, batch: 2, epochs: 3, patience: 3, temperature: 0.1 },
  };
}

/** The id a test cell is stored under. */
export function testCellId(cell: TestCell): string {
  return cellId(identityOf(cell));
}

function identityOf(cell: TestCell) {
  return cellIdentity({
    learner: learnerSpec(cell), seed: cell.seed, worldSha256: '0'.repeat(64),
    collect: { policy: 'wander', steps: 100, episodeSteps: 10, split: { train: 0.7, validation: 0.15, test: 0.15 } },
    senses: DEFAULT_SENSE_SETTINGS, probeTargets: ['x', 'wall_ahead'], noise: NOISE, vary: cell.vary ?? {},
  });
}

/**
 * Stores the cells in the order given (which may differ from the plan's), and writes
 * plan.csv listing them in `planOrder` (default: the order given) and config.resolved.yaml.
 */
export function writeRun(dir: string, cells: readonly TestCell[], options: { name: string; baseline?: string; varyKeys?: readonly string[]; planOrder?: readonly TestCell[] }): void {
  const varyKeys = options.varyKeys ?? [];
  for (const cell of cells) {
    const id = testCellId(cell);
    const spec = learnerSpec(cell);
    const record: Omit<CellRecord, 'files'> = {
      format_version: RESULTS_FORMAT_VERSION, id, index: (options.planOrder ?? cells).indexOf(cell),
      status: cell.reason == null ? 'done' : 'failed', reason: cell.reason ?? '', identity: identityOf(cell),
      backend: 'cpu', world_path: '/nowhere/world.yaml', output: { save_features: false, align_every: 50 },
      seconds: { collect: 0, train: 0, probe: 0, total: 0 }, versions: { test: '1' }, finished_at: '2026-01-01T00:00:00.000Z',
    };
    const files: Record<string, string | Uint8Array> = { 'train.csv': formatTrainCsv(cell.log) };
    if (cell.reason == null) {
      const rows = cell.rows.map((row) => ({ cell: id, learner: cell.learner, objective: spec.objective, rule: spec.rule, seed: cell.seed, vary: cell.vary ?? {}, ...row }));
      files['scores.csv'] = formatResultsCsv(rows, varyKeys);
      if (cell.testFeatures != null) files['test_features.npy'] = encodeNpy(cell.testFeatures.data, cell.testFeatures.shape);
    }
    commitCell(dir, record, files);
  }
  const entries = (options.planOrder ?? cells).map((cell, index) => ({ index, cell: testCellId(cell), learner: cell.learner, seed: cell.seed, vary: cell.vary ?? {} }));
  writeFileSync(join(dir, 'plan.csv'), formatPlanCsv({ varyKeys, entries }));
  const arms = [...new Map((options.planOrder ?? cells).map((cell) => {
    const arm = armIdentity(identityOf(cell));
    return [armKey(arm), arm] as const;
  })).values()];
  writeFileSync(join(dir, 'experiment.json'), formatExperimentRecord({ format_version: RESULTS_FORMAT_VERSION, vary_keys: [...varyKeys], arms }));
  const baseline = options.baseline == null ? '' : `probe:\n  baseline: ${options.baseline}\n`;
  writeFileSync(join(dir, 'config.resolved.yaml'), `name: ${options.name}\n${baseline}`);
}
