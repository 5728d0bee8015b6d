import { writeFileSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { reportCommand } from '../../src/commands/report.js';
import { writeFixture } from './fixture.js';

describe('crosswise report <DIR>', () => {
  const dirs: string[] = [];
  afterEach(async () => {
    vi.restoreAllMocks();
    for (const d of dirs.splice(0)) await rm(d, { recursive: true, force: true });
  });

  const capture = () => ({
    err: vi.spyOn(console, 'error').mockImplementation(() => undefined),
    out: vi.spyOn(console, 'log').mockImplementation(() => undefined),
  });

  it('exits 1 with one line naming a missing directory', async () => {
    const { err } = capture();
    expect(await reportCommand(['/nonexistent/crosswise-run'])).toBe(1);
    expect(err.mock.calls).toEqual([['crosswise report: /nonexistent/crosswise-run: no such directory']]);
  });

  it('exits 1 with one line for a folder where no sweep ran', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'report-cmd-'));
    dirs.push(dir);
    const { err } = capture();
    expect(await reportCommand([dir])).toBe(1);
    expect(err.mock.calls.length).toBe(1);
    expect(String(err.mock.calls[0][0])).toMatch(/^crosswise report: .*plan\.csv: not found/);
  });

  it('exits 1 without exactly one argument', async () => {
    const { err } = capture();
    expect(await reportCommand([])).toBe(1);
    expect(await reportCommand(['a', 'b'])).toBe(1);
    expect(err.mock.calls.map((call) => call[0])).toEqual([
      'crosswise report: missing <DIR> (usage: crosswise report <DIR>)',
      "crosswise report: unexpected argument 'b' (usage: crosswise report <DIR>)",
    ]);
  });

  it('rebuilds the report and points to the summary', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'report-cmd-'));
    dirs.push(dir);
    writeFixture(dir);
    const { out } = capture();
    expect(await reportCommand([dir])).toBe(0);
    expect(out.mock.calls.slice(0, 2).map((call) => call[0])).toEqual([`results: ${join(dir, 'results.csv')}`, `summary: ${join(dir, 'summary.md')}`]);
  });

  it('exits 5 with one line when it cannot write its files', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'report-cmd-'));
    dirs.push(dir);
    writeFixture(dir);
    // A file where the plots folder must go: no plot can be written.
    writeFileSync(join(dir, 'plots'), '');
    const { err } = capture();
    expect(await reportCommand([dir])).toBe(5);
    expect(err.mock.calls.map((call) => String(call[0]))).toEqual([expect.stringMatching(new RegExp(`^crosswise report: cannot write ${join(dir, 'plots')}\\S*: E[A-Z]+: [a-z ]+ \\(\\w+\\)$`))]);
  });
});
