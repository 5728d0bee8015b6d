import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { BACKENDS } from '../learn/spec.js';
import { cellId, cellIdentitySchema } from './cell-identity.js';
import { RESULTS_FORMAT_VERSION } from './format-version.js';
import { checkedJson, parseJsonText } from './json-text.js';
import { cellPath } from './layout.js';

const seconds = z.number().min(0);

/**
 * cells/<id>/cell.json: what happened to one cell, in snake_case like the config. The
 * id is the hash of `identity` (cellId); everything else describes the run of the cell.
 */
export const cellRecordSchema = z.object({
  format_version: z.literal(RESULTS_FORMAT_VERSION),
  id: z.string(),
  /** The cell's position in the sweep's plan (its `crosswise cell --index`). */
  index: z.number().int().min(0),
  status: z.enum(['done', 'failed']),
  /** Why the cell failed; empty when it is done. */
  reason: z.string(),
  identity: cellIdentitySchema,
  backend: z.enum(BACKENDS),
  world_path: z.string(),
  /** Output-only settings the cell ran with: they decide what was recorded, never a number. */
  output: z.object({ save_features: z.boolean(), align_every: z.number().int().min(1) }),
  seconds: z.object({ collect: seconds, train: seconds, probe: seconds, total: seconds }),
  /** Versions of the software that computed the numbers (node, crosswise, tfjs). */
  versions: z.record(z.string(), z.string()),
  /** When the cell was stored, as an ISO 8601 UTC time. */
  finished_at: z.string(),
});

/** The one description of cell.json, for its writer (experiment) and its readers (report, bench). */
export type CellRecord = z.infer<typeof cellRecordSchema>;

/** cell.json text: two-space indented JSON ending in a line break. */
export function formatCellRecord(record: CellRecord): string {
  return `${JSON.stringify(record, null, 2)}\n`;
}

/** Parses cell.json text; every problem is one line naming the file and the key. */
export function parseCellRecord(text: string, fileName: string): CellRecord {
  const json = parseJsonText(text, fileName);
  const version = (json as { format_version?: unknown } | null)?.format_version;
  if (version !== RESULTS_FORMAT_VERSION) {
    throw new Error(`${fileName}: format_version: expected ${RESULTS_FORMAT_VERSION}, got ${JSON.stringify(version) ?? 'none'} (written by another version of crosswise; run the sweep again into a new folder)`);
  }
  const record = checkedJson(cellRecordSchema, json, fileName);
  const expected = cellId(record.identity);
  if (record.id !== expected) throw new Error(`${fileName}: id: expected ${expected} (the hash of its identity), got '${record.id}'`);
  return record;
}

/** Reads the cell.json of a stored cell, which must be the record of the cell its folder names. */
export function readCellRecord(out: string, id: string): CellRecord {
  const path = cellPath(out, id, 'record');
  const record = parseCellRecord(readFileSync(path, 'utf8'), path);
  if (record.id !== id) throw new Error(`${path}: id: expected ${id} (its folder's name), got '${record.id}'`);
  return record;
}
