import { existsSync, renameSync } from 'node:fs';
import { join } from 'node:path';
import { writeFolderAtomic } from './atomic-file.js';
import { fileManifest, formatCellRecord, type CellRecord } from './cell-record.js';
import { cellDir, CELL_FILES, cellPath, outputPath } from './layout.js';
import { partialName, removeQuietly, removeStalePartials } from './partial-files.js';
import { inspectStoredCell } from './stored-cell.js';

/** Whether a cell folder holds a cell.json (finished, done or failed); whether it can be trusted is `inspectStoredCell`. */
export function isFinished(out: string, id: string): boolean {
  return existsSync(cellPath(out, id, 'record'));
}

/**
 * Stores a finished cell: its record, completed with the size and checksum of every
 * other file, and those files, committed at once (commitCellFolder). With
 * `replaceFailed`, a stored failed cell of the same id gives way to this one.
 */
export function commitCell(
  out: string, record: Omit<CellRecord, 'files'>, files: Readonly<Record<string, string | Uint8Array>>, replaceFailed = false,
): CellRecord {
  const complete: CellRecord = { ...record, files: fileManifest(files) };
  const storedFailed = (): boolean => {
    const stored = inspectStoredCell(out, record.id);
    return stored.state === 'trusted' && stored.record.status === 'failed';
  };
  commitCellFolder(out, record.id, { ...files, [CELL_FILES.record]: formatCellRecord(complete) }, replaceFailed ? storedFailed : undefined);
  return complete;
}

/**
 * Stores a cell's files all at once: they are written into a temporary folder that is
 * then renamed to `cells/<id>`, so a killed process never leaves a partly written cell.
 * A folder already there is replaced only when `replace` says so (a failed cell being
 * retried); otherwise another process finished the same cell first and its copy, which
 * holds the same numbers, is kept.
 */
export function commitCellFolder(
  out: string, id: string, files: Readonly<Record<string, string | Uint8Array>>, replace: () => boolean = () => false,
): void {
  const target = cellDir(out, id);
  const cells = outputPath(out, 'cells');
  const temporary = join(cells, partialName(''));
  try {
    if (existsSync(target) && replace()) {
      const old = join(cells, partialName(''));
      renameSync(target, old);
      try {
        writeFolderAtomic(target, temporary, files);
      } catch (error) {
        renameSync(old, target); // the stored record stays until a new one can take its place
        throw error;
      }
      removeQuietly(old);
      return;
    }
    writeFolderAtomic(target, temporary, files);
  } catch (error) {
    // Another process finished the same cell first; its copy holds the same numbers.
    if (!isFinished(out, id)) throw error;
  }
}

/**
 * Moves a damaged cell folder out of the way, never deleting it: `cells/<id>` becomes
 * `cells/.damaged-<id>-<n>` with the first free n. Returns the new folder's name.
 */
export function moveCellAside(out: string, id: string): string {
  const cells = outputPath(out, 'cells');
  let n = 1;
  while (existsSync(join(cells, `.damaged-${id}-${n}`))) n++;
  const name = `.damaged-${id}-${n}`;
  renameSync(cellDir(out, id), join(cells, name));
  return name;
}

/**
 * Removes the temporary files and folders that killed processes on this machine left in
 * an output folder (`results.csv.partial-*`, `plots/*.partial-*`, `cells/.partial-*`).
 */
export function removeLeftovers(out: string): void {
  for (const dir of [out, outputPath(out, 'plots'), outputPath(out, 'cells')]) removeStalePartials(dir);
}
