import type { EpochLog } from '../learn/spec.js';
import { csvLine, parseCsv } from './csv.js';
import { formatCsvNumber, parseCsvNumber } from './csv-number.js';

/** The fixed columns of train.csv; `alignment_deg_<layer>` columns follow when angles were recorded. */
export const TRAIN_COLUMNS = ['epoch', 'train_loss', 'validation_loss', 'seconds'] as const;

const ALIGNMENT = 'alignment_deg_';

/** train.csv text: one line per epoch, with one alignment column per weight layer when recorded. */
export function formatTrainCsv(log: readonly EpochLog[]): string {
  const layers = Math.max(0, ...log.map((entry) => entry.alignmentDeg.length));
  let text = csvLine([...TRAIN_COLUMNS, ...Array.from({ length: layers }, (_, i) => `${ALIGNMENT}${i + 1}`)]);
  for (const entry of log) {
    const angles = Array.from({ length: layers }, (_, i) => (i < entry.alignmentDeg.length ? formatCsvNumber(entry.alignmentDeg[i]) : ''));
    text += csvLine([String(entry.epoch), ...[entry.trainLoss, entry.validationLoss, entry.seconds].map(formatCsvNumber), ...angles]);
  }
  return text;
}

/**
 * Parses train.csv text back into the epoch log: epochs must run 1, 2, 3, … in order;
 * empty alignment fields at the end of a line are angles that were not recorded.
 */
export function parseTrainCsv(text: string, fileName: string): EpochLog[] {
  const [header, ...records] = parseCsv(text, fileName);
  const columns = header?.fields ?? [];
  TRAIN_COLUMNS.forEach((name, i) => {
    if (columns[i] !== name) throw new Error(`${fileName}:1: column ${i + 1}: expected '${name}', got '${columns[i] ?? ''}'`);
  });
  columns.slice(TRAIN_COLUMNS.length).forEach((name, i) => {
    const expected = `${ALIGNMENT}${i + 1}`;
    if (name !== expected) throw new Error(`${fileName}:1: column ${TRAIN_COLUMNS.length + i + 1}: expected '${expected}', got '${name}'`);
  });
  return records.map(({ line, fields }, i): EpochLog => {
    if (fields.length !== columns.length) throw new Error(`${fileName}:${line}: expected ${columns.length} fields, got ${fields.length}`);
    if (fields[0] !== String(i + 1)) throw new Error(`${fileName}:${line}: epoch: expected ${i + 1}, got '${fields[0]}'`);
    const number = (at: number): number => {
      const value = parseCsvNumber(fields[at]);
      if (value == null) throw new Error(`${fileName}:${line}: ${columns[at]}: expected a number, got '${fields[at]}'`);
      return value;
    };
    let recorded = fields.length;
    while (recorded > TRAIN_COLUMNS.length && fields[recorded - 1] === '') recorded--;
    return {
      epoch: i + 1,
      trainLoss: number(1),
      validationLoss: number(2),
      seconds: number(3),
      alignmentDeg: Array.from({ length: recorded - TRAIN_COLUMNS.length }, (_, j) => number(TRAIN_COLUMNS.length + j)),
    };
  });
}
