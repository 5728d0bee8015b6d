import { join } from 'node:path';
import { summarise, type Summary } from '../stats/summarise.js';
import { linearCka } from './cka.js';
import { comboKey, unique, type Combination } from './groups.js';
import type { CellRecord, StoredRun } from './load.js';
import { readNpy, type NpyArray } from './npy.js';

/** CKA between every pair of learners on clean test features, summarised over seeds. */
export interface LearnerCka {
  readonly learners: readonly string[];
  /** [i][j]: CKA of learner i with learner j across seeds. */
  readonly matrix: readonly (readonly Summary[])[];
}

/** The done cells of a combination, matched by the cell ids in its result rows or by the vary values in cell.json. */
export function cellsOf(run: StoredRun, combo: Combination): CellRecord[] {
  const ids = new Set(combo.rows.map((r) => r.cell));
  const key = comboKey(combo.values, run.varyKeys);
  return run.cells.filter((c) => ids.has(c.id) || (c.status !== 'done' && comboKey(c.vary, run.varyKeys) === key));
}

/**
 * Linear CKA (Kornblith et al. 2019) between learners of one seed on the stored
 * test_features.npy (the same clean test rows for every learner of a seed), averaged
 * over seeds. Null when fewer than two learners stored features.
 */
export async function learnerCka(run: StoredRun, combo: Combination, warnings: string[]): Promise<LearnerCka | null> {
  const cells = cellsOf(run, combo).filter((c) => c.status === 'done' && c.hasFeatures);
  const learners = unique(combo.rows.map((r) => r.learner)).filter((l) => cells.some((c) => c.learner === l));
  if (learners.length < 2) return null;
  const values = learners.map(() => learners.map((): number[] => []));
  for (const seed of unique(cells.map((c) => c.seed))) {
    const features = new Map<string, NpyArray>();
    for (const c of cells.filter((cell) => cell.seed === seed)) {
      const path = join(run.outDir, 'cells', c.id, 'test_features.npy');
      try {
        const array = await readNpy(path);
        if (array.shape.length !== 2) throw new Error(`${path}: expected a 2-D array [rows, features], got shape (${array.shape.join(', ')})`);
        features.set(c.learner, array);
      } catch (error) {
        warnings.push((error as Error).message);
      }
    }
    learners.forEach((a, i) => learners.forEach((b, j) => {
      const fa = features.get(a);
      const fb = features.get(b);
      if (fa == null || fb == null) return;
      const rows = Math.min(fa.shape[0], fb.shape[0]);
      if (fa.shape[0] !== fb.shape[0] && i < j) warnings.push(`seed ${seed}: ${a} and ${b} stored different test row counts; CKA uses the first ${rows}`);
      values[i][j].push(linearCka(fa.data.subarray(0, rows * fa.shape[1]), fa.shape[1], fb.data.subarray(0, rows * fb.shape[1]), fb.shape[1]));
    }));
  }
  return { learners, matrix: values.map((row) => row.map((v) => summarise(v))) };
}
