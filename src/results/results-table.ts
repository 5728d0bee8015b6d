import { SEED_MEASURES, type SeedMeasure } from '../probe/robustness.js';
import { csvLine, parseCsv, type CsvRecord } from './csv.js';
import { formatCsvNumber, formatOptionalNumber, parseCsvNumber } from './csv-number.js';

/**
 * What a row measures: `score` is a probe score at one severity; `noisy`, `drop` and `area`
 * are per-seed robustness measures over every severity of a noise (no severity of their own).
 */
export const MEASURES = ['score', ...SEED_MEASURES] as const;
export type Measure = (typeof MEASURES)[number];

/** Metrics a row may carry: probe scores (r2, accuracy), the chance level beside accuracy, and CKA ('-' target). */
export const RESULT_METRICS = ['r2', 'accuracy', 'chance', 'cka'] as const;
export type ResultMetric = (typeof RESULT_METRICS)[number];

/** The fixed leading columns of results.csv and of each cell's scores.csv; one column per vary key follows. */
export const RESULTS_COLUMNS = [
  'cell', 'learner', 'objective', 'rule', 'seed', 'target', 'channel', 'kind',
  'severity', 'parameter', 'measure', 'metric', 'value',
] as const;

/** One measurement of a cell: a results row without the columns the cell itself contributes. */
export interface Measurement {
  /** A probe target, or '-' for CKA rows, which describe the representation itself. */
  readonly target: string;
  readonly channel: string;
  readonly kind: string;
  /** The severity level; null for the per-seed measures, which span every severity. */
  readonly severity: number | null;
  /**
   * The corruption parameter used at that severity (σ in training standard deviations for
   * gaussian, a probability for dropout and blackout, an SNR in dB for masking; the clean
   * value at severity 0, which for masking is +∞, written `inf`); null when severity is.
   */
  readonly parameter: number | null;
  readonly measure: Measure;
  readonly metric: ResultMetric;
  readonly value: number;
}

/** The columns a cell contributes to each of its rows. */
export interface CellColumns {
  readonly cell: string;
  readonly learner: string;
  readonly objective: string;
  readonly rule: string;
  readonly seed: number;
  /** Value of each vary key for this cell, as text. */
  readonly vary: Readonly<Record<string, string>>;
}

/** One row of results.csv (and of a cell's scores.csv). */
export interface ResultRow extends CellColumns, Measurement {}

/** A probe score at one severity: a row whose severity and parameter are always present. */
export type Score<T extends Measurement> = T & { readonly measure: 'score'; readonly severity: number; readonly parameter: number };

/** A results row holding a probe score at one severity. */
export type ScoreRow = Score<ResultRow>;

/** Whether a row is a probe score at one severity. */
export function isScore<T extends Measurement>(row: T): row is Score<T> {
  return row.measure === 'score';
}

/** A per-seed robustness measure: a row with no severity or parameter of its own. */
export type SeedMeasureOf<T extends Measurement> = T & { readonly measure: SeedMeasure; readonly severity: null; readonly parameter: null };

/** A results row holding a per-seed robustness measure (noisy, drop or area). */
export type MeasureRow = SeedMeasureOf<ResultRow>;

/** Whether a row is a per-seed robustness measure. */
export function isSeedMeasure<T extends Measurement>(row: T): row is SeedMeasureOf<T> {
  return row.measure !== 'score';
}

/** A parsed results table. */
export interface ResultsTable {
  readonly varyKeys: readonly string[];
  readonly rows: readonly ResultRow[];
}

/** Results CSV text: the fixed columns, then one column per vary key in the given order. */
export function formatResultsCsv(rows: readonly ResultRow[], varyKeys: readonly string[]): string {
  let text = csvLine([...RESULTS_COLUMNS, ...varyKeys]);
  for (const r of rows) {
    text += csvLine([
      r.cell, r.learner, r.objective, r.rule, String(r.seed), r.target, r.channel, r.kind,
      formatOptionalNumber(r.severity), formatOptionalNumber(r.parameter), r.measure, r.metric, formatCsvNumber(r.value),
      ...varyKeys.map((k) => r.vary[k] ?? ''),
    ]);
  }
  return text;
}

/** Parses results CSV text; every problem is reported as `file:line: column: what was expected`. */
export function parseResultsCsv(text: string, fileName = 'results.csv'): ResultsTable {
  const records = parseCsv(text, fileName);
  if (records.length === 0) throw new Error(`${fileName}:1: empty file, expected a header line`);
  const header = records[0].fields;
  RESULTS_COLUMNS.forEach((name, i) => {
    if (header[i] !== name) throw new Error(`${fileName}:1: column ${i + 1}: expected '${name}', got '${header[i] ?? ''}'`);
  });
  const varyKeys = header.slice(RESULTS_COLUMNS.length);
  return { varyKeys, rows: records.slice(1).map((record) => parseRow(record, header, fileName)) };
}

type Column = (typeof RESULTS_COLUMNS)[number];

function parseRow({ line, fields }: CsvRecord, header: readonly string[], fileName: string): ResultRow {
  if (fields.length !== header.length) throw new Error(`${fileName}:${line}: expected ${header.length} fields, got ${fields.length}`);
  const at = (column: Column): string => fields[RESULTS_COLUMNS.indexOf(column)];
  const fail = (column: Column, expected: string): never => {
    throw new Error(`${fileName}:${line}: ${column}: expected ${expected}, got '${at(column)}'`);
  };
  const measure = oneOf(at('measure'), MEASURES) ?? fail('measure', `one of ${MEASURES.join(', ')}`);
  const metric = oneOf(at('metric'), RESULT_METRICS) ?? fail('metric', `one of ${RESULT_METRICS.join(', ')}`);
  const seed = Number(at('seed'));
  if (at('seed') === '' || !Number.isInteger(seed)) fail('seed', 'an integer');
  // A score belongs to one severity and its parameter; a per-seed measure to neither.
  const level = (column: 'severity' | 'parameter'): number | null => {
    if (measure !== 'score') return at(column) === '' ? null : fail(column, `an empty field for measure '${measure}'`);
    const value = parseCsvNumber(at(column));
    return value == null || Number.isNaN(value) ? fail(column, `a number for measure 'score'`) : value;
  };
  const value = parseCsvNumber(at('value')) ?? fail('value', 'a number, inf, -inf or an empty field');
  const vary: Record<string, string> = {};
  header.slice(RESULTS_COLUMNS.length).forEach((key, i) => { vary[key] = fields[RESULTS_COLUMNS.length + i]; });
  return {
    cell: at('cell'), learner: at('learner'), objective: at('objective'), rule: at('rule'), seed,
    target: at('target'), channel: at('channel'), kind: at('kind'),
    severity: level('severity'), parameter: level('parameter'), measure, metric, value, vary,
  };
}

function oneOf<T extends string>(text: string, allowed: readonly T[]): T | null {
  return (allowed as readonly string[]).includes(text) ? text as T : null;
}
