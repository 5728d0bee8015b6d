import { randomUUID } from 'node:crypto';
import { readdirSync, rmSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';

// Files and folders being written are named <base>.partial-<host>-<pid>-<uuid>, so a
// cleanup only touches those of dead processes on this machine, never those of a
// process still writing (a cluster task on another machine, a report running beside).
const PARTIAL = '.partial-';

/** The temporary name under which `base` is written before it is renamed into place. */
export function partialName(base: string): string {
  return `${base}${PARTIAL}${hostname()}-${process.pid}-${randomUUID()}`;
}

/** Whether a file or folder name is a temporary one (of any process, on any machine). */
export function isPartialName(name: string): boolean {
  return name.includes(PARTIAL);
}

/** Removes the temporary files and folders in `dir` that killed processes on this machine left behind; returns their names. */
export function removeStalePartials(dir: string): string[] {
  let entries: string[];
  try {
    entries = readdirSync(dir);
  } catch {
    return []; // no such folder, or not one: nothing to clean up
  }
  const mine = `${PARTIAL}${hostname()}-`;
  const removed: string[] = [];
  for (const entry of entries) {
    const at = entry.indexOf(mine);
    if (at < 0) continue;
    const pid = Number(entry.slice(at + mine.length).split('-')[0]);
    if (Number.isInteger(pid) && !isAlive(pid)) {
      rmSync(join(dir, entry), { recursive: true, force: true });
      removed.push(entry);
    }
  }
  return removed;
}

/** Whether a process with this id runs on this machine. */
export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0); // signal 0 only checks that the process exists
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Removes a temporary file or folder after a failed write; a failure to remove it must not hide the write's own error. */
export function removeQuietly(path: string): void {
  try {
    rmSync(path, { recursive: true, force: true });
  } catch {
    // Left for removeStalePartials once this process has ended.
  }
}
