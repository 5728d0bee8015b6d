import { existsSync } from 'node:fs';
import { readdir, readFile, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { parse as parseYaml } from 'yaml';
import { parseCsv } from '../results/csv.js';
import { isScore, parseResultsCsv, type ResultsTable, type ScoreRow } from '../results/results-table.js';

/** What the report reads from a cell folder (cells/<id>/cell.json and train.csv); the writer's form is CellRecord in experiment/store.ts. */
export interface StoredCell {
  readonly id: string;
  readonly learner: string;
  readonly seed: number;
  readonly status: 'done' | 'failed' | 'unknown';
  readonly reason: string;
  readonly vary: Readonly<Record<string, string>>;
  /** This cell's validation loss per epoch from train.csv, [epoch − 1]; empty without train.csv. */
  readonly validationLoss: readonly number[];
  /** Angle in degrees between the rule's update and the true gradient at the last epoch, per layer (alignment_deg_<layer> columns). */
  readonly finalAlignmentDeg: Readonly<Record<string, number>>;
  readonly hasFeatures: boolean;
}

/** Everything the report is built from. */
export interface StoredRun {
  readonly outDir: string;
  readonly name: string;
  readonly baseline: string | null;
  readonly varyKeys: readonly string[];
  /** The probe scores at each severity. */
  readonly rows: readonly ScoreRow[];
  readonly cells: readonly StoredCell[];
  readonly warnings: readonly string[];
}

/** Reads an output directory (DESIGN, Output layout); throws a one-line error when there is nothing to report. */
export async function loadRun(outDir: string): Promise<StoredRun> {
  if (!existsSync(outDir) || !(await stat(outDir)).isDirectory()) throw new Error(`${outDir}: no such directory`);
  const resultsPath = join(outDir, 'results.csv');
  const table = existsSync(resultsPath)
    ? parseResultsCsv(await readFile(resultsPath, 'utf8'), resultsPath)
    : await cellResults(join(outDir, 'cells'));
  if (table == null) throw new Error(`${resultsPath}: not found (no results to report; run the sweep first)`);
  if (table.rows.length === 0) throw new Error(`${resultsPath}: holds no result rows (no results to report)`);
  const warnings: string[] = [];
  const config = await readConfig(join(outDir, 'config.resolved.yaml'), warnings);
  const cells = await readCells(join(outDir, 'cells'), warnings);
  const learners = new Set(table.rows.map((r) => r.learner));
  let baseline = config.baseline;
  if (baseline == null) warnings.push('config.resolved.yaml: probe.baseline: not set, so no paired comparisons or CE');
  else if (!learners.has(baseline)) {
    warnings.push(`config.resolved.yaml: probe.baseline: '${baseline}' has no results, so no paired comparisons or CE`);
    baseline = null;
  }
  return { outDir, name: config.name, baseline, varyKeys: table.varyKeys, rows: table.rows.filter(isScore), cells, warnings };
}

/**
 * Without a top-level results.csv (e.g. cells run on other machines and copied in), the
 * union of the cells' own scores (cells/<id>/scores.csv, the same format); null when there are none.
 */
async function cellResults(dir: string): Promise<ResultsTable | null> {
  if (!existsSync(dir)) return null;
  const paths = (await readdir(dir)).sort().map((id) => join(dir, id, 'scores.csv')).filter(existsSync);
  if (paths.length === 0) return null;
  const tables = await Promise.all(paths.map(async (p) => parseResultsCsv(await readFile(p, 'utf8'), p)));
  const varyKeys = tables[0].varyKeys;
  tables.forEach((t, i) => {
    if (JSON.stringify(t.varyKeys) !== JSON.stringify(varyKeys)) {
      throw new Error(`${paths[i]}:1: vary columns ${t.varyKeys.join(', ') || '(none)'} differ from ${paths[0]}'s ${varyKeys.join(', ') || '(none)'}`);
    }
  });
  return { varyKeys, rows: tables.flatMap((t) => t.rows) };
}

async function readConfig(path: string, warnings: string[]): Promise<{ name: string; baseline: string | null }> {
  if (!existsSync(path)) {
    warnings.push(`${path}: not found`);
    return { name: 'crosswise run', baseline: null };
  }
  const doc: unknown = parseYaml(await readFile(path, 'utf8'), { merge: true });
  const record = (v: unknown): Record<string, unknown> => (typeof v === 'object' && v != null ? v as Record<string, unknown> : {});
  const name = record(doc).name;
  const baseline = record(record(doc).probe).baseline;
  return { name: typeof name === 'string' ? name : 'crosswise run', baseline: typeof baseline === 'string' ? baseline : null };
}

async function readCells(dir: string, warnings: string[]): Promise<StoredCell[]> {
  if (!existsSync(dir)) return [];
  const ids = (await readdir(dir, { withFileTypes: true })).filter((e) => e.isDirectory()).map((e) => e.name).sort();
  const cells: StoredCell[] = [];
  for (const id of ids) {
    const jsonPath = join(dir, id, 'cell.json');
    if (!existsSync(jsonPath)) continue; // an unfinished cell: nothing was committed
    try {
      cells.push(await readCell(join(dir, id), id, warnings));
    } catch (error) {
      warnings.push((error as Error).message);
    }
  }
  return cells;
}

async function readCell(dir: string, id: string, warnings: string[]): Promise<StoredCell> {
  const jsonPath = join(dir, 'cell.json');
  let json: Record<string, unknown>;
  try {
    json = JSON.parse(await readFile(jsonPath, 'utf8')) as Record<string, unknown>;
  } catch (error) {
    throw new Error(`${jsonPath}: not valid JSON (${(error as Error).message})`);
  }
  const status = json.status === 'done' || json.status === 'failed' ? json.status : 'unknown';
  const vary: Record<string, string> = {};
  if (typeof json.vary === 'object' && json.vary != null) {
    for (const [k, v] of Object.entries(json.vary)) vary[k] = typeof v === 'string' ? v : JSON.stringify(v);
  }
  const trainPath = join(dir, 'train.csv');
  let training: ReturnType<typeof parseTrainCsv> = { validationLoss: [], finalAlignmentDeg: {} };
  try {
    if (existsSync(trainPath)) training = parseTrainCsv(await readFile(trainPath, 'utf8'), trainPath);
  } catch (error) {
    warnings.push(`${(error as Error).message} (training curve left out)`);
  }
  return {
    id,
    learner: typeof json.learner === 'string' ? json.learner : '?',
    seed: typeof json.seed === 'number' ? json.seed : NaN,
    status,
    reason: typeof json.reason === 'string' ? json.reason : '',
    vary,
    ...training,
    hasFeatures: existsSync(join(dir, 'test_features.npy')),
  };
}

/** The validation_loss column of a train.csv indexed by epoch − 1, and the last row's alignment angles. */
function parseTrainCsv(text: string, path: string): { validationLoss: number[]; finalAlignmentDeg: Record<string, number> } {
  const [header, ...records] = parseCsv(text, path);
  const epochAt = header?.fields.indexOf('epoch') ?? -1;
  const lossAt = header?.fields.indexOf('validation_loss') ?? -1;
  if (epochAt < 0 || lossAt < 0) throw new Error(`${path}:1: expected columns 'epoch' and 'validation_loss'`);
  const losses: number[] = [];
  for (const { line, fields } of records) {
    const epoch = Number(fields[epochAt]);
    if (!Number.isInteger(epoch) || epoch < 1) throw new Error(`${path}:${line}: epoch: expected a positive integer, got '${fields[epochAt]}'`);
    losses[epoch - 1] = numberOrNaN(fields[lossAt]);
  }
  const finalAlignmentDeg: Record<string, number> = {};
  const last = records.at(-1);
  header.fields.forEach((name, i) => {
    if (last != null && name.startsWith('alignment_deg_')) finalAlignmentDeg[name.slice('alignment_deg_'.length)] = numberOrNaN(last.fields[i]);
  });
  return { validationLoss: Array.from(losses, (v) => v ?? NaN), finalAlignmentDeg };
}

/** A CSV number; an empty field is a missing value, not 0. */
function numberOrNaN(text: string | undefined): number {
  return text == null || text.trim() === '' ? NaN : Number(text);
}
