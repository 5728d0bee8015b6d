import type { ScoreRow } from '../experiment/events.js';
import { csvLine, parseCsv } from './csv.js';

/** The fixed leading columns of results.csv (DESIGN, Output layout); vary keys follow. */
export const RESULTS_COLUMNS = [
  'cell', 'learner', 'objective', 'rule', 'seed', 'target', 'channel', 'kind', 'severity', 'metric', 'value',
] as const;

/** Metrics a results row may carry: probe scores (r2, accuracy), the chance level beside accuracy, and CKA ('-' target). */
export const RESULT_METRICS = ['r2', 'accuracy', 'chance', 'cka'] as const;

/**
 * One measurement: one row of results.csv. The same shape as the runner's rows (a
 * ScoreRow with its cell), so either side can write and read the other's files.
 */
export interface ResultRow extends ScoreRow {
  readonly cell: string;
  readonly objective: string;
  readonly rule: string;
  /** Value of each vary key for this cell, as text. */
  readonly vary: Readonly<Record<string, string>>;
}

/** A parsed results table. */
export interface ResultsTable {
  readonly varyKeys: readonly string[];
  readonly rows: readonly ResultRow[];
}

/** Writes rows as results.csv text: the fixed columns, then one column per vary key in the given order. */
export function formatResultsCsv(rows: readonly ResultRow[], varyKeys: readonly string[]): string {
  let text = csvLine([...RESULTS_COLUMNS, ...varyKeys]);
  for (const r of rows) {
    const fixed = [r.cell, r.learner, r.objective, r.rule, String(r.seed), r.target, r.channel, r.kind,
      String(r.severity), r.metric, String(r.value)];
    text += csvLine([...fixed, ...varyKeys.map((k) => r.vary[k] ?? '')]);
  }
  return text;
}

/** Parses results.csv text; every problem is reported as `file:line: column: what was expected`. */
export function parseResultsCsv(text: string, fileName = 'results.csv'): ResultsTable {
  const records = parseCsv(text, fileName);
  if (records.length === 0) throw new Error(`${fileName}:1: empty file, expected a header line`);
  const header = records[0].fields;
  RESULTS_COLUMNS.forEach((name, i) => {
    if (header[i] !== name) {
      throw new Error(`${fileName}:1: column ${i + 1}: expected '${name}', got '${header[i] ?? ''}'`);
    }
  });
  const varyKeys = header.slice(RESULTS_COLUMNS.length);
  const rows = records.slice(1).map(({ line, fields }) => {
    if (fields.length !== header.length) {
      throw new Error(`${fileName}:${line}: expected ${header.length} fields, got ${fields.length}`);
    }
    const at = (name: string): string => fields[header.indexOf(name)];
    const metric = at('metric');
    if (!(RESULT_METRICS as readonly string[]).includes(metric)) {
      throw new Error(`${fileName}:${line}: metric: expected one of ${RESULT_METRICS.join(', ')}, got '${metric}'`);
    }
    const vary: Record<string, string> = {};
    varyKeys.forEach((k, i) => { vary[k] = fields[RESULTS_COLUMNS.length + i]; });
    return {
      cell: at('cell'), learner: at('learner'), objective: at('objective'), rule: at('rule'),
      seed: integer(at('seed'), fileName, line, 'seed'),
      target: at('target'), channel: at('channel'), kind: at('kind'),
      severity: number(at('severity'), fileName, line, 'severity'),
      metric,
      value: number(at('value'), fileName, line, 'value'),
      vary,
    };
  });
  return { varyKeys, rows };
}

function number(text: string, fileName: string, line: number, column: string): number {
  // NaN is a legitimate stored value (e.g. an undefined R²); empty or other text is not.
  const v = text.trim() === '' ? NaN : Number(text);
  if (Number.isNaN(v) && text !== 'NaN') throw new Error(`${fileName}:${line}: ${column}: expected a number, got '${text}'`);
  return v;
}

function integer(text: string, fileName: string, line: number, column: string): number {
  const v = Number(text);
  if (text.trim() === '' || !Number.isInteger(v)) {
    throw new Error(`${fileName}:${line}: ${column}: expected an integer, got '${text}'`);
  }
  return v;
}
