import type { EpochLog, LayerFiring } from '../learn/spec.js';
import { csvLine, parseCsv } from './csv.js';
import { formatCsvNumber, parseCsvNumber } from './csv-number.js';

/**
 * The fixed columns of train.csv. Numbered columns per layer follow, each group only when
 * recorded: `alignment_deg_<layer>` (non-backprop rules), then `firing_rate_hz_<layer>` and
 * `silent_fraction_<layer>` (spiking encoders).
 */
export const TRAIN_COLUMNS = ['epoch', 'train_loss', 'validation_loss', 'seconds'] as const;

const ALIGNMENT = 'alignment_deg_';
const RATE = 'firing_rate_hz_';
const SILENT = 'silent_fraction_';

/** `<prefix>1 … <prefix>count`. */
function numbered(prefix: string, count: number): string[] {
  return Array.from({ length: count }, (_, i) => `${prefix}${i + 1}`);
}

/** The values of one group of per-layer columns, padded with empty fields to `count`. */
function fields(values: readonly number[], count: number): string[] {
  return Array.from({ length: count }, (_, i) => (i < values.length ? formatCsvNumber(values[i]) : ''));
}

/** train.csv text: one line per epoch, with the per-layer columns that were recorded. */
export function formatTrainCsv(log: readonly EpochLog[]): string {
  const angles = Math.max(0, ...log.map((entry) => entry.alignmentDeg.length));
  const layers = Math.max(0, ...log.map((entry) => entry.firing?.rateHz.length ?? 0));
  let text = csvLine([...TRAIN_COLUMNS, ...numbered(ALIGNMENT, angles), ...numbered(RATE, layers), ...numbered(SILENT, layers)]);
  for (const entry of log) {
    text += csvLine([
      String(entry.epoch), ...[entry.trainLoss, entry.validationLoss, entry.seconds].map(formatCsvNumber),
      ...fields(entry.alignmentDeg, angles), ...fields(entry.firing?.rateHz ?? [], layers), ...fields(entry.firing?.silentFraction ?? [], layers),
    ]);
  }
  return text;
}

/** How many columns from `start` are `<prefix>1, <prefix>2, …`. */
function groupLength(columns: readonly string[], start: number, prefix: string): number {
  let n = 0;
  while (columns[start + n] === `${prefix}${n + 1}`) n++;
  return n;
}

/**
 * Parses train.csv text back into the epoch log: epochs must run 1, 2, 3, … in order; empty
 * alignment fields at the end of their group are angles that were not recorded, and a line
 * whose firing fields are all empty recorded no firing.
 */
export function parseTrainCsv(text: string, fileName: string): EpochLog[] {
  const [header, ...records] = parseCsv(text, fileName);
  const columns = header?.fields ?? [];
  TRAIN_COLUMNS.forEach((name, i) => {
    if (columns[i] !== name) throw new Error(`${fileName}:1: column ${i + 1}: expected '${name}', got '${columns[i] ?? ''}'`);
  });
  const angles = groupLength(columns, TRAIN_COLUMNS.length, ALIGNMENT);
  const layers = groupLength(columns, TRAIN_COLUMNS.length + angles, RATE);
  const expected = [...TRAIN_COLUMNS, ...numbered(ALIGNMENT, angles), ...numbered(RATE, layers), ...numbered(SILENT, layers)];
  columns.forEach((name, i) => {
    if (name !== expected[i]) throw new Error(`${fileName}:1: column ${i + 1}: expected ${expected[i] == null ? 'no more columns' : `'${expected[i]}'`}, got '${name}'`);
  });
  if (columns.length < expected.length) throw new Error(`${fileName}:1: column ${columns.length + 1}: expected '${expected[columns.length]}'`);
  return records.map(({ line, fields: values }, i): EpochLog => {
    if (values.length !== columns.length) throw new Error(`${fileName}:${line}: expected ${columns.length} fields, got ${values.length}`);
    if (values[0] !== String(i + 1)) throw new Error(`${fileName}:${line}: epoch: expected ${i + 1}, got '${values[0]}'`);
    const number = (at: number): number => {
      const value = parseCsvNumber(values[at]);
      if (value == null) throw new Error(`${fileName}:${line}: ${columns[at]}: expected a number, got '${values[at]}'`);
      return value;
    };
    const group = (start: number, count: number) => Array.from({ length: count }, (_, j) => number(start + j));
    let recorded = angles;
    while (recorded > 0 && values[TRAIN_COLUMNS.length + recorded - 1] === '') recorded--;
    const firingStart = TRAIN_COLUMNS.length + angles;
    const firing: LayerFiring | null = layers === 0 || values.slice(firingStart).every((v) => v === '')
      ? null
      : { rateHz: group(firingStart, layers), silentFraction: group(firingStart + layers, layers) };
    return {
      epoch: i + 1,
      trainLoss: number(1),
      validationLoss: number(2),
      seconds: number(3),
      alignmentDeg: group(TRAIN_COLUMNS.length, recorded),
      ...(firing == null ? {} : { firing }),
    };
  });
}
