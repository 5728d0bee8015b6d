import { summarise, type Summary } from '../stats/summarise.js';
import { preparedCka, prepareCka } from '../probe/cka.js';
import { comboKey, unique, type Combination } from './groups.js';
import type { StoredCell, StoredRun } from './load.js';
import { cellArrayPath, TEST_FEATURES } from '../results/layout.js';
import { readNpy, type NpyArray } from '../results/npy.js';

/** CKA between every pair of learners on clean test features, summarised over seeds. */
export interface LearnerCka {
  readonly learners: readonly string[];
  /** [i][j]: CKA of learner i with learner j across seeds. */
  readonly matrix: readonly (readonly Summary[])[];
}

/** The cells of a combination: those whose id appears in its result rows, and unfinished or failed ones whose cell.json vary values match. */
export function cellsOf(run: StoredRun, combo: Combination): StoredCell[] {
  const ids = new Set(combo.rows.map((r) => r.cell));
  const key = comboKey(combo.values, run.varyKeys);
  return run.cells.filter(({ record }) => ids.has(record.id) || (record.status !== 'done' && comboKey(record.identity.vary, run.varyKeys) === key));
}

/**
 * Linear CKA (Kornblith et al. 2019) between learners of one seed on the stored
 * test_features.npy (the same clean test rows for every learner of a seed), averaged
 * over seeds. Null when fewer than two learners stored features.
 */
export async function learnerCka(run: StoredRun, combo: Combination, warnings: string[]): Promise<LearnerCka | null> {
  const cells = cellsOf(run, combo).filter((c) => c.record.status === 'done' && c.hasFeatures);
  const learners = unique(combo.rows.map((r) => r.learner)).filter((l) => cells.some((c) => c.record.identity.learner.name === l));
  if (learners.length < 2) return null;
  const values = learners.map(() => learners.map((): number[] => []));
  for (const seed of unique(cells.map((c) => c.record.identity.seed))) {
    const features = await seedFeatures(run, cells.filter((c) => c.record.identity.seed === seed), warnings);
    if (features.size === 0) continue;
    const rows = Math.min(...[...features.values()].map((f) => f.shape[0]));
    if ([...features.values()].some((f) => f.shape[0] !== rows)) {
      warnings.push(`seed ${seed}: learners stored different numbers of test rows; CKA between learners uses the first ${rows}`);
    }
    const prepared = new Map([...features].map(([learner, f]) => [learner, prepareCka(f.data.subarray(0, rows * f.shape[1]), rows, f.shape[1])]));
    learners.forEach((a, i) => learners.forEach((b, j) => {
      const pa = prepared.get(a);
      const pb = prepared.get(b);
      if (j < i || pa == null || pb == null) return;
      const value = preparedCka(pa, pb);
      values[i][j].push(value);
      if (j !== i) values[j][i].push(value);
    }));
  }
  return { learners, matrix: values.map((row) => row.map((v) => summarise(v))) };
}

/** The 2-D test features of one seed's cells, by learner; unreadable files become warnings. */
async function seedFeatures(run: StoredRun, cells: readonly StoredCell[], warnings: string[]): Promise<Map<string, NpyArray>> {
  const features = new Map<string, NpyArray>();
  for (const { record } of cells) {
    const path = cellArrayPath(run.outDir, record.id, TEST_FEATURES);
    try {
      const array = await readNpy(path);
      if (array.shape.length !== 2) throw new Error(`${path}: expected a 2-D array [rows, features], got shape (${array.shape.join(', ')})`);
      features.set(record.identity.learner.name, array);
    } catch (error) {
      warnings.push((error as Error).message);
    }
  }
  return features;
}
