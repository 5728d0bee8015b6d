import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { lockOutput } from '../../src/experiment/output-lock.js';
import { scratchFolders } from '../scratch.js';

describe('the run lock of an output folder', () => {
  const folder = scratchFolders('crosswise-lock-');
  const lockFile = (out: string) => join(out, 'run.lock');
  const warnings: string[] = [];
  const warn = (line: string) => warnings.push(line);
  afterEach(() => { warnings.length = 0; });
  /** The pid of a process that has exited: no process has it now. */
  const deadPid = () => spawnSync(process.execPath, ['-e', '0']).pid as number;

  it('records host and pid while held and is gone once released', () => {
    const out = folder();
    const release = lockOutput(out, false, warn);
    expect(JSON.parse(readFileSync(lockFile(out), 'utf8'))).toMatchObject({ host: hostname(), pid: process.pid });
    release();
    expect(existsSync(lockFile(out))).toBe(false);
    expect(warnings).toEqual([]);
  });

  it('refuses a second runner while a live process holds it, naming that process', () => {
    const out = folder();
    const release = lockOutput(out, false, warn);
    expect(() => lockOutput(out, false, warn)).toThrow(new RegExp(`^${out} is in use by another crosswise run \\(pid ${process.pid} on this machine, since \\S+\\); wait for it to finish or stop it$`));
    // --force does not take a lock from a run that is still going on this machine.
    expect(() => lockOutput(out, true, warn)).toThrow(/is in use by another crosswise run/);
    release();
  });

  it('takes over, with a warning, the lock of a process that is gone from this machine', () => {
    const out = folder();
    const pid = deadPid();
    writeFileSync(lockFile(out), JSON.stringify({ host: hostname(), pid, started_at: '2026-01-01T00:00:00.000Z' }));
    const release = lockOutput(out, false, warn);
    expect(warnings).toEqual([`${out}: took over the lock of a run that is gone (pid ${pid} on this machine, since 2026-01-01T00:00:00.000Z)`]);
    expect(JSON.parse(readFileSync(lockFile(out), 'utf8'))).toMatchObject({ pid: process.pid });
    release();
  });

  it('refuses the lock of another machine unless forced', () => {
    const out = folder();
    writeFileSync(lockFile(out), JSON.stringify({ host: 'node17.cluster.example', pid: 4242, started_at: '2026-01-01T00:00:00.000Z' }));
    expect(() => lockOutput(out, false, warn)).toThrow(`${out} is in use by pid 4242 on node17.cluster.example, since 2026-01-01T00:00:00.000Z; `
      + 'if that run is no longer running, run again with --force to take the folder over');
    const release = lockOutput(out, true, warn);
    expect(warnings).toEqual([`${out}: took over the lock of a run elsewhere, with --force (pid 4242 on node17.cluster.example, since 2026-01-01T00:00:00.000Z)`]);
    release();
  });

  it('leaves alone, when released, a lock that another run has taken over meanwhile', () => {
    const out = folder();
    const release = lockOutput(out, false, warn);
    const theirs = JSON.stringify({ host: 'elsewhere.example', pid: 1, started_at: '2026-01-01T00:00:00.000Z' });
    writeFileSync(lockFile(out), theirs);
    release();
    expect(readFileSync(lockFile(out), 'utf8')).toBe(theirs);
  });
});
