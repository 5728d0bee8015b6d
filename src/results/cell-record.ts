import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { BACKENDS } from '../learn/spec.js';
import { cellId, cellIdentitySchema } from './cell-identity.js';
import { RESULTS_FORMAT_VERSION } from './format-version.js';
import { checkedJson, parseJsonText } from './json-text.js';
import { cellPath } from './layout.js';

const seconds = z.number().min(0);

/** A file name inside a cell folder: no path separators, not hidden. */
const CELL_FILE_NAME = /^[A-Za-z0-9_][A-Za-z0-9_.-]*$/;

/** What a cell's file held when it was stored: its size and SHA-256, so a reader can tell a damaged file. */
const storedFileSchema = z.object({ bytes: z.number().int().min(0), sha256: z.string().regex(/^[0-9a-f]{64}$/) });

/** A stored file's size and checksum as cell.json records them. */
export type StoredFile = z.infer<typeof storedFileSchema>;

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
  /**
   * The plug-ins the cell used (left out when it used none): the part each played, its name,
   * the absolute path of its file when the cell ran, and the hash its identity holds.
   */
  plugins: z.array(z.object({ type: z.string(), name: z.string(), path: z.string(), sha256: z.string() })).optional(),
  /** Output-only settings the cell ran with: they decide what was recorded, never a number. */
  output: z.object({ save_features: z.boolean(), align_every: z.number().int().min(1) }),
  seconds: z.object({ collect: seconds, train: seconds, probe: seconds, total: seconds }),
  /** Versions of the software that computed the numbers (node, crosswise, tfjs). */
  versions: z.record(z.string(), z.string()),
  /** When the cell was stored, as an ISO 8601 UTC time. */
  finished_at: z.string(),
  /** Every other file of the cell folder by name, as it was committed. */
  files: z.record(z.string().regex(CELL_FILE_NAME, 'a plain file name'), storedFileSchema),
});

/** The one description of cell.json, for its writer (experiment) and its readers (report, bench). */
export type CellRecord = z.infer<typeof cellRecordSchema>;

/** The size and SHA-256 of each file's content, for cell.json's `files`. */
export function fileManifest(files: Readonly<Record<string, string | Uint8Array>>): Record<string, StoredFile> {
  return Object.fromEntries(Object.entries(files).map(([name, content]) => [name, storedFile(content)]));
}

/** The size and SHA-256 of one file's content. */
export function storedFile(content: string | Uint8Array): StoredFile {
  const bytes = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
  return { bytes: bytes.byteLength, sha256: createHash('sha256').update(bytes).digest('hex') };
}

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
