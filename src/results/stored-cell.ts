import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { canonicalJson, type CellIdentity } from './cell-identity.js';
import { parseCellRecord, type CellRecord } from './cell-record.js';
import { cellDir, CELL_FILES } from './layout.js';

/** What is wrong with a stored cell: the file, and what happened to it. */
export interface CellFault {
  readonly file: string;
  readonly fault: string;
}

/** A planned cell's folder as found on disk. */
export type StoredCellState =
  | { readonly state: 'absent' }
  | { readonly state: 'trusted'; readonly record: CellRecord }
  | { readonly state: 'damaged'; readonly fault: CellFault };

/**
 * Whether the stored cell `id` can be trusted: its cell.json parses, is the record of
 * this id (and of `identity`, the experiment's settings for it, when given), and every file it
 * lists is there with the size and SHA-256 recorded when the cell was committed.
 * Anything else is `damaged`, naming the first file at fault; nothing throws.
 */
export function inspectStoredCell(out: string, id: string, identity?: CellIdentity): StoredCellState {
  const dir = cellDir(out, id);
  const listing = attempt(() => readdirSync(dir));
  if (listing instanceof Error) {
    return code(listing) === 'ENOENT' ? { state: 'absent' } : damaged('(folder)', `unreadable (${code(listing)})`);
  }
  if (!listing.includes(CELL_FILES.record)) return damaged(CELL_FILES.record, 'missing');
  const text = attempt(() => readFileSync(join(dir, CELL_FILES.record), 'utf8'));
  if (text instanceof Error) return damaged(CELL_FILES.record, `unreadable (${code(text)})`);
  if (text.trim() === '') return damaged(CELL_FILES.record, 'empty');
  const record = attempt(() => parseCellRecord(text, CELL_FILES.record));
  if (record instanceof Error) return damaged(CELL_FILES.record, record.message.slice(`${CELL_FILES.record}: `.length));
  if (record.id !== id) return damaged(CELL_FILES.record, `holds cell ${record.id}`);
  if (identity != null && canonicalJson(record.identity) !== canonicalJson(identity)) return damaged(CELL_FILES.record, "settings differ from the experiment's");
  for (const [name, expected] of Object.entries(record.files)) {
    const fault = fileFault(join(dir, name), expected);
    if (fault != null) return damaged(name, fault);
  }
  return { state: 'trusted', record };
}

/** The one-line warning about a damaged cell: `cell <id>: scores.csv truncated — recomputing`. */
export function cellFaultLine(id: string, fault: CellFault, consequence: string): string {
  return `cell ${id}: ${fault.file === '(folder)' ? 'folder' : fault.file} ${fault.fault} — ${consequence}`;
}

function fileFault(path: string, expected: CellRecord['files'][string]): string | null {
  const size = attempt(() => statSync(path).size);
  if (size instanceof Error) return code(size) === 'ENOENT' ? 'missing' : `unreadable (${code(size)})`;
  if (size === 0 && expected.bytes > 0) return 'empty';
  if (size < expected.bytes) return `truncated (${size} of ${expected.bytes} bytes)`;
  if (size > expected.bytes) return `longer than stored (${size} of ${expected.bytes} bytes)`;
  const content = attempt(() => readFileSync(path));
  if (content instanceof Error) return `unreadable (${code(content)})`;
  return createHash('sha256').update(content).digest('hex') === expected.sha256 ? null : 'changed since it was stored (SHA-256 differs)';
}

function damaged(file: string, fault: string): StoredCellState {
  return { state: 'damaged', fault: { file, fault } };
}

function attempt<T>(read: () => T): T | Error {
  try {
    return read();
  } catch (error) {
    return error instanceof Error ? error : new Error(String(error));
  }
}

function code(error: Error): string {
  return (error as NodeJS.ErrnoException).code ?? error.message;
}
