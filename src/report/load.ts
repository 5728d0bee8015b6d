import { existsSync, readFileSync, statSync } from 'node:fs';
import { CONTROL_OBJECTIVES, type EpochLog, type ObjectiveName } from '../learn/spec.js';
import type { SeedMeasure } from '../probe/robustness.js';
import { isFinished } from '../results/cell-folder.js';
import { readCellRecord, type CellRecord } from '../results/cell-record.js';
import { cellArrayPath, cellPath, TEST_FEATURES } from '../results/layout.js';
import { outputOrder } from '../results/output-order.js';
import { readPlan } from '../results/plan-table.js';
import { isScore, isSeedMeasure, type MeasureRow, type ResultsTable, type ScoreRow } from '../results/results-table.js';
import { readRunSettings } from '../results/run-settings.js';
import { readStoredResults } from '../results/stored-results.js';
import { parseTrainCsv } from '../results/train-table.js';

/** A stored cell as the report uses it: its record, its training log and whether it kept test features. */
export interface StoredCell {
  readonly record: CellRecord;
  /** The epochs of train.csv; empty when it is missing or unreadable (with a warning). */
  readonly log: readonly EpochLog[];
  readonly hasFeatures: boolean;
}

/** Everything the report is built from. */
export interface StoredRun {
  readonly outDir: string;
  readonly name: string;
  readonly baseline: string | null;
  readonly varyKeys: readonly string[];
  /** Every row of results.csv, as written beside the report. */
  readonly results: ResultsTable;
  /** The probe scores at each severity, in config order. */
  readonly rows: readonly ScoreRow[];
  /** The per-seed robustness measures (noisy, drop, area), in config order. */
  readonly measures: readonly MeasureRow[];
  /** The measure the primary family tests. */
  readonly primary: SeedMeasure;
  /** Every learner of the config (or, without one, of the results) in order, and whether it is a control. */
  readonly learners: ReadonlyMap<string, boolean>;
  /** The config's probe targets and noise entries, the planned primary family's other factors; null when unknown. */
  readonly plannedFactors: { readonly targets: number; readonly noises: number } | null;
  /** The plan's finished cells, in config order. */
  readonly cells: readonly StoredCell[];
  readonly warnings: readonly string[];
}

/**
 * Reads an output folder: its plan, the stored cells and config.resolved.yaml. Throws a
 * one-line error when there is nothing to report; damaged cell files become warnings.
 */
export function loadRun(outDir: string): StoredRun {
  if (!existsSync(outDir) || !statSync(outDir).isDirectory()) throw new Error(`${outDir}: no such directory`);
  const plan = readPlan(outDir);
  const results = readStoredResults(outDir, plan);
  if (results.rows.length === 0) throw new Error(`${outDir}: no cell of the plan has results yet (nothing to report)`);
  const warnings: string[] = [];
  const settings = readRunSettings(outDir, warnings);
  const cells = outputOrder(plan.entries, plan.varyKeys)
    .filter((entry) => isFinished(outDir, entry.cell))
    .flatMap((entry) => storedCell(outDir, entry.cell, warnings));
  const rows = results.rows.filter(isScore);
  const measures = results.rows.filter(isSeedMeasure);
  let baseline = settings.baseline;
  if (baseline == null) warnings.push('config.resolved.yaml: probe.baseline: not set, so no paired comparisons or CE');
  else if (!rows.some((r) => r.learner === baseline)) {
    warnings.push(`config.resolved.yaml: probe.baseline: '${baseline}' has no results, so no paired comparisons or CE`);
    baseline = null;
  }
  return {
    outDir, name: settings.name, baseline, varyKeys: plan.varyKeys, results, rows, measures, cells, warnings,
    primary: settings.primary ?? 'noisy', // the config's default, for a config.resolved.yaml that does not say
    learners: learnerControls(settings.controls, results.rows),
    plannedFactors: settings.targets == null || settings.noises == null ? null : { targets: settings.targets, noises: settings.noises },
  };
}

/**
 * Each learner's control flag: as config.resolved.yaml states it (every learner, in
 * config order), else, for learners it does not list, by their objective.
 */
function learnerControls(stated: ReadonlyMap<string, boolean>, rows: ResultsTable['rows']): Map<string, boolean> {
  const controls = new Map(stated);
  for (const row of rows) {
    if (!controls.has(row.learner)) controls.set(row.learner, CONTROL_OBJECTIVES.includes(row.objective as ObjectiveName));
  }
  return controls;
}

function storedCell(outDir: string, id: string, warnings: string[]): StoredCell[] {
  let record: CellRecord;
  try {
    record = readCellRecord(outDir, id);
  } catch (error) {
    warnings.push((error as Error).message);
    return [];
  }
  const trainPath = cellPath(outDir, id, 'train');
  let log: EpochLog[] = [];
  try {
    if (existsSync(trainPath)) log = parseTrainCsv(readFileSync(trainPath, 'utf8'), trainPath);
  } catch (error) {
    warnings.push(`${(error as Error).message} (training curve left out)`);
  }
  return [{ record, log, hasFeatures: existsSync(cellArrayPath(outDir, id, TEST_FEATURES)) }];
}
