import { randomUUID } from 'node:crypto';
import { existsSync, readdirSync, renameSync, rmSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { writeFolderAtomic } from './atomic-file.js';
import { cellDir, cellPath, outputPath } from './layout.js';

/** Whether a cell is finished (done or failed); only a complete folder ever exists under its id. */
export function isFinished(out: string, id: string): boolean {
  return existsSync(cellPath(out, id, 'record'));
}

/**
 * Stores a cell's files all at once: they are written into a temporary folder that is
 * then renamed to `cells/<id>`, so a killed process never leaves a partly written cell.
 */
export function commitCellFolder(out: string, id: string, files: Readonly<Record<string, string | Uint8Array>>): void {
  const target = cellDir(out, id);
  const temporary = join(outputPath(out, 'cells'), `${PARTIAL}${hostname()}-${process.pid}-${randomUUID()}`);
  try {
    writeFolderAtomic(target, temporary, files);
  } catch (error) {
    // Another process finished the same cell first; its copy holds the same numbers.
    if (!isFinished(out, id)) throw error;
  }
}

/**
 * Removes a stored cell so that it can be computed again. The folder is first renamed to a
 * temporary name, so no reader ever sees it half deleted; when another process removed it
 * first, there is nothing left to do.
 */
export function discardCell(out: string, id: string): void {
  const aside = join(outputPath(out, 'cells'), `${PARTIAL}${hostname()}-${process.pid}-${randomUUID()}`);
  try {
    renameSync(cellDir(out, id), aside);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return;
    throw error;
  }
  rmSync(aside, { recursive: true, force: true });
}

// Temporary cell folders are named .partial-<host>-<pid>-<uuid>, so a cleanup only
// touches those of dead processes on this machine, never those of a running task.
const PARTIAL = '.partial-';

/** Removes temporary cell folders that killed processes on this machine left behind. */
export function removePartialCells(out: string): void {
  const cells = outputPath(out, 'cells');
  if (!existsSync(cells)) return;
  const mine = `${PARTIAL}${hostname()}-`;
  for (const entry of readdirSync(cells)) {
    if (!entry.startsWith(mine)) continue;
    const pid = Number(entry.slice(mine.length).split('-')[0]);
    if (!isAlive(pid)) rmSync(join(cells, entry), { recursive: true, force: true });
  }
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0); // signal 0 only checks that the process exists
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}
