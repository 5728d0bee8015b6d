import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { encodeNpy } from '../../src/results/npy.js';
import { formatResultsCsv, type ResultRow } from '../../src/results/results-table.js';

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

const META: Readonly<Record<string, readonly [string, string]>> = {
  'sound-from-sight': ['predict', 'feedback-alignment'],
  'sight-autoencoder': ['reconstruct', 'backprop'],
  untrained: ['untrained', 'backprop'],
};

/** Writes the fixture output directory and returns the rows written. */
export async function writeFixture(dir: string, options: { features?: boolean } = {}): Promise<ResultRow[]> {
  const rows: ResultRow[] = [];
  const learners = Object.keys(SCORES);
  for (const learner of learners) {
    for (const seed of [1, 2, 3]) {
      const cell = `${learner.slice(0, 5)}-${seed}`;
      const base = { cell, learner, objective: META[learner][0], rule: META[learner][1], seed, channel: 'sight', kind: 'gaussian', vary: {} };
      for (const severity of [0, 1]) {
        const at = { severity, parameter: [0, 0.25][severity], measure: 'score' } as const; // σ from the severity table
        rows.push({ ...base, target: 'x', ...at, metric: 'r2', value: SCORES[learner][seed][severity] });
        rows.push({ ...base, target: 'wall_ahead', ...at, metric: 'accuracy', value: 0.9 - 0.1 * severity - 0.01 * seed });
        rows.push({ ...base, target: 'wall_ahead', ...at, metric: 'chance', value: 0.6 });
        rows.push({ ...base, target: '-', ...at, metric: 'cka', value: 1 - 0.2 * severity });
      }
      const cellDir = join(dir, 'cells', cell);
      await mkdir(cellDir, { recursive: true });
      await writeFile(join(cellDir, 'cell.json'), JSON.stringify({ learner, seed, status: 'done', reason: '' }));
      await writeFile(join(cellDir, 'train.csv'), META[learner][1] === 'feedback-alignment'
        // Alignment angles (columns named as the runner names them): layer 1 ends at 60 + seed degrees, layer 2 at 0.
        ? `epoch,train_loss,validation_loss,seconds,alignment_deg_1,alignment_deg_2\n1,1.0,1.2,0.1,89,0\n2,0.8,0.9,0.1,${60 + seed},0\n`
        : 'epoch,train_loss,validation_loss,seconds\n1,1.0,1.2,0.1\n2,0.8,0.9,0.1\n3,0.7,0.8,0.1\n');
      if (options.features === true) {
        // [4 rows, 2 features]: every learner sees the same rows; untrained is a scaled copy (CKA 1).
        const f = learner === 'sight-autoencoder' ? [1, 0, 0, 1, 1, 1, 2, 0] : [1, 2, 3, 4, 5, 6, 7, 9];
        await writeFile(join(cellDir, 'test_features.npy'), encodeNpy(Float32Array.from(f, (v) => (learner === 'untrained' ? 3 * v : v)), [4, 2]));
      }
    }
  }
  const failed = join(dir, 'cells', 'forec-1');
  await mkdir(failed, { recursive: true });
  await writeFile(join(failed, 'cell.json'), JSON.stringify({ learner: 'sight-forecaster', seed: 1, status: 'failed', reason: 'loss became NaN at epoch 2' }));
  await writeFile(join(dir, 'results.csv'), formatResultsCsv(rows, []));
  await writeFile(join(dir, 'config.resolved.yaml'), 'name: fixture-run\nprobe:\n  baseline: sight-autoencoder\nvary: {}\n');
  return rows;
}
