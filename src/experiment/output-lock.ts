import { linkSync, mkdirSync, readFileSync, renameSync, unlinkSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { OutputBusyError } from '../results/experiment-record.js';
import { outputPath } from '../results/layout.js';
import { isAlive, partialName, removeQuietly } from '../results/partial-files.js';

/** Who holds an output folder's run lock: the content of run.lock. */
interface LockHolder {
  readonly host: string;
  readonly pid: number;
  /** When the run started, ISO 8601 UTC. */
  readonly started_at: string;
}

/**
 * Takes the run lock of an output folder, so two `crosswise run`s never work on one
 * folder at once; returns the function that gives it back. The lock is run.lock,
 * created with its content in one step (a hard link to a finished temporary file fails
 * when the lock exists, also over NFS). A lock held by a live process is refused with an
 * OutputBusyError naming it; a lock whose process is gone from this machine is taken over
 * with a warning; a lock from another machine is taken over only with `force`.
 */
export function lockOutput(out: string, force: boolean, warn: (line: string) => void): () => void {
  mkdirSync(out, { recursive: true });
  const path = outputPath(out, 'lock');
  const mine = `${JSON.stringify({ host: hostname(), pid: process.pid, started_at: new Date().toISOString() } satisfies LockHolder)}\n`;
  for (let attempt = 0; attempt < 5; attempt++) {
    if (tryCreate(path, mine)) return () => release(path, mine);
    const held = readLock(path);
    if (held == null) continue; // released between our two looks
    const holder = parseHolder(held);
    const who = holder == null ? 'a run.lock that cannot be read' : describe(holder);
    if (holder != null && holder.host === hostname() && isAlive(holder.pid)) {
      throw new OutputBusyError(`${out} is in use by another crosswise run (${who}); wait for it to finish or stop it`);
    }
    const gone = holder != null && holder.host === hostname();
    if (!gone && !force) {
      throw new OutputBusyError(`${out} is in use by ${who}; if that run is no longer running, run again with --force to take the folder over`);
    }
    if (takeOver(path, held)) warn(`${out}: took over the lock of ${gone ? 'a run that is gone' : 'a run elsewhere, with --force'} (${who})`);
  }
  throw new OutputBusyError(`${out}: run.lock keeps changing; another crosswise run is starting there`);
}

function describe(holder: LockHolder): string {
  const where = holder.host === hostname() ? 'this machine' : holder.host;
  return `pid ${holder.pid} on ${where}, since ${holder.started_at}`;
}

/** Creates the lock with its content at once; false when a lock is already there. */
function tryCreate(path: string, content: string): boolean {
  const temporary = partialName(path);
  try {
    writeFileSync(temporary, content);
    linkSync(temporary, path);
    return true;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'EEXIST') return false;
    throw error;
  } finally {
    removeQuietly(temporary);
  }
}

function readLock(path: string): string | null {
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
}

function parseHolder(text: string): LockHolder | null {
  try {
    const value = JSON.parse(text) as Partial<LockHolder>;
    return typeof value.host === 'string' && Number.isInteger(value.pid) && typeof value.started_at === 'string' ? value as LockHolder : null;
  } catch {
    return null;
  }
}

/**
 * Removes a stale lock whose content was `stale`. It is first renamed aside, so of two
 * runs taking over at once only one removes it; if what was renamed is not the stale
 * lock (a third run locked in between), it is put back. True when this run removed it.
 */
function takeOver(path: string, stale: string): boolean {
  const aside = partialName(path);
  try {
    renameSync(path, aside);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false;
    throw error;
  }
  if (readLock(aside) !== stale) {
    renameSync(aside, path);
    return false;
  }
  unlinkSync(aside);
  return true;
}

/** Gives the lock back, unless another run has taken it over meanwhile (with --force). */
function release(path: string, mine: string): void {
  if (readLock(path) === mine) removeQuietly(path);
}
