import { join } from 'node:path';

/** Files and folders of an output folder (README, "What a run writes"). */
export const OUTPUT_FILES = {
  experiment: 'experiment.json',
  lock: 'run.lock',
  config: 'config.resolved.yaml',
  plan: 'plan.csv',
  results: 'results.csv',
  summary: 'summary.md',
  comparisons: 'comparisons.csv',
  plots: 'plots',
  cells: 'cells',
  plugins: 'plugins',
} as const;

/** Files of one cell folder; arrays are stored beside them as `<name>.npy`. */
export const CELL_FILES = {
  record: 'cell.json',
  train: 'train.csv',
  scores: 'scores.csv',
} as const;

/** The array of clean test features every finished cell stores, for CKA between learners. */
export const TEST_FEATURES = 'test_features';

/** Path of a file or folder of an output folder. */
export function outputPath(out: string, file: keyof typeof OUTPUT_FILES): string {
  return join(out, OUTPUT_FILES[file]);
}

/** The folder of one cell. */
export function cellDir(out: string, id: string): string {
  return join(out, OUTPUT_FILES.cells, id);
}

/** Path of one file of a cell folder. */
export function cellPath(out: string, id: string, file: keyof typeof CELL_FILES): string {
  return join(cellDir(out, id), CELL_FILES[file]);
}

/** Path of an array stored in a cell folder. */
export function cellArrayPath(out: string, id: string, name: string): string {
  return join(cellDir(out, id), `${name}.npy`);
}

/**
 * Where a sweep keeps the bundled script of a plug-in (plain JavaScript that worker threads and
 * cluster tasks load): named by the plug-in's name and content hash, so a changed plug-in
 * gets a new file and never overwrites the script earlier cells ran.
 */
export function pluginBundlePath(out: string, name: string, sha256: string): string {
  return join(out, OUTPUT_FILES.plugins, `${name}-${sha256.slice(0, 16)}.cjs`);
}
