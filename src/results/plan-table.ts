import { existsSync, readFileSync } from 'node:fs';
import { csvLine, parseCsv } from './csv.js';
import { outputPath } from './layout.js';

/** The fixed columns of plan.csv; one column per vary key follows. */
export const PLAN_COLUMNS = ['index', 'cell', 'learner', 'seed'] as const;

/** One cell of a sweep's plan. */
export interface PlanEntry {
  /** Position in the plan: vary combinations slowest, then seeds, then learners, each in config order. */
  readonly index: number;
  readonly cell: string;
  readonly learner: string;
  readonly seed: number;
  readonly vary: Readonly<Record<string, string>>;
}

/** A sweep's plan: every cell it consists of, finished or not, in index order. */
export interface Plan {
  readonly varyKeys: readonly string[];
  readonly entries: readonly PlanEntry[];
}

/** plan.csv text. */
export function formatPlanCsv(plan: Plan): string {
  let text = csvLine([...PLAN_COLUMNS, ...plan.varyKeys]);
  for (const e of plan.entries) text += csvLine([String(e.index), e.cell, e.learner, String(e.seed), ...plan.varyKeys.map((k) => e.vary[k] ?? '')]);
  return text;
}

/** Parses plan.csv text; indices must run 0, 1, 2, … in order. */
export function parsePlanCsv(text: string, fileName: string): Plan {
  const [header, ...records] = parseCsv(text, fileName);
  const columns = header?.fields ?? [];
  PLAN_COLUMNS.forEach((name, i) => {
    if (columns[i] !== name) throw new Error(`${fileName}:1: column ${i + 1}: expected '${name}', got '${columns[i] ?? ''}'`);
  });
  const varyKeys = columns.slice(PLAN_COLUMNS.length);
  const entries = records.map(({ line, fields }, i): PlanEntry => {
    if (fields.length !== columns.length) throw new Error(`${fileName}:${line}: expected ${columns.length} fields, got ${fields.length}`);
    if (fields[0] !== String(i)) throw new Error(`${fileName}:${line}: index: expected ${i}, got '${fields[0]}'`);
    const seed = Number(fields[3]);
    if (fields[3] === '' || !Number.isInteger(seed)) throw new Error(`${fileName}:${line}: seed: expected an integer, got '${fields[3]}'`);
    const vary = Object.fromEntries(varyKeys.map((key, j) => [key, fields[PLAN_COLUMNS.length + j]]));
    return { index: i, cell: fields[1], learner: fields[2], seed, vary };
  });
  return { varyKeys, entries };
}

/** Reads the plan.csv of an output folder; throws a one-line error when there is none. */
export function readPlan(out: string): Plan {
  const path = outputPath(out, 'plan');
  if (!existsSync(path)) throw new Error(`${path}: not found (no sweep was run in this folder; run it first)`);
  return parsePlanCsv(readFileSync(path, 'utf8'), path);
}
