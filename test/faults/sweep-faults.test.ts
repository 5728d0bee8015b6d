// Faults injected into real tiny sweeps (the test double stands in for the cell work, so
// each cell takes milliseconds). After each fault: the message names the cell and the
// fault, no result is lost or invented, and a rerun gives results.csv byte-identical to
// an undisturbed run of the same config.
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, truncateSync, unlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { reportCommand } from '../../src/commands/report.js';
import { createRng, randomInt } from '../../src/random.js';
import { parsePlanCsv } from '../../src/results/plan-table.js';
import { configFolder, spawnWithFake, type Finished } from '../experiment/helpers.js';

const CONFIG = `name: faults
world: world.yaml
seeds: [1, 2]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], train: { epochs: 2 } }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight], train: { epochs: 2 } }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2] }
probe:
  targets: [wall_ahead, material_ahead, nearest_distance_m, heading, x]   # each varies in the shed (one emitter: nearest_emitter would not)
out: out
`;

/** Runs the sweep of `dir` with two jobs; `env` may install a fault (CROSSWISE_FAULT) or slow the cells down. */
function run(dir: string, args: readonly string[] = [], env: Record<string, string> = {}, onLine?: Parameters<typeof spawnWithFake>[1]): Promise<Finished> {
  return spawnWithFake(['run', join(dir, 'config.yaml'), '--jobs', '2', ...args], onLine, env);
}

const out = (dir: string) => join(dir, 'out');
const results = (dir: string) => readFileSync(join(out(dir), 'results.csv'), 'utf8');
const planIds = (dir: string) => parsePlanCsv(readFileSync(join(out(dir), 'plan.csv'), 'utf8'), 'plan.csv').entries.map((e) => e.cell);
const cellFile = (dir: string, id: string, file: string) => join(out(dir), 'cells', id, file);
const folders = (dir: string) => readdirSync(join(out(dir), 'cells')).sort();
const lines = (text: string) => text.split('\n').filter((line) => line !== '');

describe('faults in a real tiny sweep', () => {
  let reference: string;
  let undisturbed: string;
  beforeAll(async () => {
    reference = configFolder(CONFIG);
    const first = await run(reference);
    expect(first.code).toBe(0);
    undisturbed = results(reference);
    // 4 cells × 5 probe targets × (2 severities + the per-seed noisy, drop and area), plus the header.
    expect(lines(undisturbed)).toHaveLength(4 * 5 * (2 + 3) + 1);
  });

  /** A copy of the finished reference sweep, to damage. */
  const finishedCopy = (): string => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-faults-'));
    cpSync(reference, dir, { recursive: true });
    return dir;
  };

  it('recomputes cells whose cell.json was truncated, emptied or deleted, or whose scores.csv was truncated, moving each aside', async () => {
    const dir = finishedCopy();
    const [a, b, c, d] = planIds(dir);
    truncateSync(cellFile(dir, a, 'cell.json'), 100);
    truncateSync(cellFile(dir, b, 'cell.json'), 0);
    unlinkSync(cellFile(dir, c, 'cell.json'));
    const scoresBytes = readFileSync(cellFile(dir, d, 'scores.csv')).byteLength;
    truncateSync(cellFile(dir, d, 'scores.csv'), 50);
    const rerun = await run(dir);
    expect(rerun.code).toBe(0);
    const warnings = lines(rerun.stderr);
    expect(warnings).toHaveLength(4);
    expect(warnings).toContain(`crosswise run: warning: cell ${b}: cell.json empty — moved to cells/.damaged-${b}-1, recomputing`);
    expect(warnings).toContain(`crosswise run: warning: cell ${c}: cell.json missing — moved to cells/.damaged-${c}-1, recomputing`);
    expect(warnings).toContain(`crosswise run: warning: cell ${d}: scores.csv truncated (50 of ${scoresBytes} bytes) — moved to cells/.damaged-${d}-1, recomputing`);
    expect(warnings.some((line) => line.startsWith(`crosswise run: warning: cell ${a}: cell.json not valid JSON (`) && line.endsWith(`moved to cells/.damaged-${a}-1, recomputing`))).toBe(true);
    expect(rerun.stdout).toContain('4 cells, 0 already finished');
    expect(folders(dir)).toEqual([...[a, b, c, d].map((id) => `.damaged-${id}-1`), a, b, c, d].sort());
    expect(results(dir)).toBe(undisturbed);
  });

  it('recomputes a cell whose scores.csv was deleted, and report leaves it out with a warning instead of reporting fewer rows silently', async () => {
    const dir = finishedCopy();
    const [a] = planIds(dir);
    unlinkSync(cellFile(dir, a, 'scores.csv'));
    const errors = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const log = vi.spyOn(console, 'log').mockImplementation(() => undefined);
    try {
      expect(await reportCommand([out(dir)])).toBe(0);
      expect(errors.mock.calls.map((call) => String(call[0]))).toContain(`crosswise report: warning: cell ${a}: scores.csv missing — left out (crosswise run recomputes it)`);
    } finally {
      errors.mockRestore();
      log.mockRestore();
    }
    expect(lines(results(dir))).toHaveLength(3 * 5 * (2 + 3) + 1);
    const rerun = await run(dir);
    expect(rerun.code).toBe(0);
    expect(lines(rerun.stderr)).toEqual([`crosswise run: warning: cell ${a}: scores.csv missing — moved to cells/.damaged-${a}-1, recomputing`]);
    expect(results(dir)).toBe(undisturbed);
  });

  it('recomputes a cell whose folder cannot be read (EACCES injected on reading it)', async () => {
    const dir = finishedCopy();
    const [, b] = planIds(dir);
    const rerun = await run(dir, [], { CROSSWISE_FAULT: `readdirSync:EACCES:cells/${b}:1` });
    expect(rerun.code).toBe(0);
    expect(lines(rerun.stderr)).toEqual([`crosswise run: warning: cell ${b}: folder unreadable (EACCES) — moved to cells/.damaged-${b}-1, recomputing`]);
    expect(results(dir)).toBe(undisturbed);
  });

  it('on a full disk (ENOSPC injected on every scores.csv) fails the cells that hit it, one line each, starts no new ones and exits 5', async () => {
    const dir = configFolder(CONFIG);
    const full = await run(dir, [], { CROSSWISE_FAULT: 'writeFileSync:ENOSPC:scores.csv' });
    expect(full.code).toBe(5);
    const failures = lines(full.stderr).filter((line) => !line.includes('no new cells were started'));
    // Both cells that were running when the disk filled finish and fail to be stored; the other two never start.
    expect(failures).toHaveLength(2);
    for (const line of failures) {
      expect(line).toMatch(/^crosswise run: cell [0-3] \([0-9a-f]{10}\): cannot write \S+\/cells\/\.partial-\S+\/scores\.csv: ENOSPC: no space left on device \(write\)$/);
    }
    expect(full.stderr).toContain(`no new cells were started after a write failed; free space or fix the folder's permissions, then resume with: crosswise run ${join(dir, 'config.yaml')}`);
    expect(lines(full.stdout).filter((line) => line.includes('] start '))).toHaveLength(2);
    // Nothing half-written stays behind: no cell folder, no temporary folder.
    expect(folders(dir)).toEqual([]);
    const rerun = await run(dir);
    expect(rerun.code).toBe(0);
    expect(results(dir)).toBe(undisturbed);
  });

  it('when one cell cannot be stored (EACCES injected once on its temporary folder), the running cell is still stored and no new one starts', async () => {
    const dir = configFolder(CONFIG);
    const denied = await run(dir, [], { CROSSWISE_FAULT: 'mkdirSync:EACCES:.partial-:1' });
    expect(denied.code).toBe(5);
    const failures = lines(denied.stderr).filter((line) => !line.includes('no new cells were started'));
    expect(failures).toHaveLength(1);
    expect(failures[0]).toMatch(/^crosswise run: cell [0-3] \([0-9a-f]{10}\): cannot write \S+\/cells\/\.partial-\S+: EACCES: permission denied \(mkdir\)$/);
    const started = lines(denied.stdout).filter((line) => line.includes('] start ')).length;
    expect(started).toBeLessThan(4);
    expect(folders(dir)).toHaveLength(started - 1);
    const rerun = await run(dir);
    expect(rerun.code).toBe(0);
    expect(rerun.stdout).toContain(`4 cells, ${started - 1} already finished`);
    expect(results(dir)).toBe(undisturbed);
  });

  it('exits 5 when the report cannot be written (ENOSPC injected on summary.md), naming the file', async () => {
    const dir = configFolder(CONFIG);
    const failed = await run(dir, [], { CROSSWISE_FAULT: 'writeFileSync:ENOSPC:summary.md' });
    expect(failed.code).toBe(5);
    expect(lines(failed.stderr)[0]).toMatch(/^crosswise run: the report could not be written: cannot write \S+\/summary\.md\.partial-\S+: ENOSPC: no space left on device \(write\)$/);
    expect(results(dir)).toBe(undisturbed);
  });

  it('fails only the cells whose worker thread dies (exit code 134 injected), stores the rest and exits 3; --retry-failed computes them', async () => {
    const dir = configFolder(CONFIG);
    const dying = await run(dir, [], { FAKE_DYING: 'sight-autoencoder' });
    expect(dying.code).toBe(3);
    expect(lines(dying.stdout).filter((line) => line.includes('FAILED sight-autoencoder'))).toHaveLength(2);
    expect(dying.stdout).toMatch(/FAILED sight-autoencoder seed 1 \([0-9a-f]{10}\): worker exited with code 134/);
    const rows = lines(results(dir));
    expect(rows.slice(1).every((row) => row.includes(',sound-from-sight,'))).toBe(true);
    expect(rows).toEqual(lines(undisturbed).filter((row, i) => i === 0 || row.includes(',sound-from-sight,')));
    expect(lines(dying.stderr)).toEqual([`crosswise run: 2 cells failed; compute them again with: crosswise run ${join(dir, 'config.yaml')} --retry-failed`]);
    const retried = await run(dir, ['--retry-failed']);
    expect(retried.code).toBe(0);
    expect(retried.stdout).toContain('4 cells, 2 already finished');
    expect(folders(dir)).toHaveLength(4);
    expect(results(dir)).toBe(undisturbed);
  });

  it('refuses a folder owned by another config (other hidden sizes) with one line and exit 4, writing nothing; more seeds and learners extend it; --force takes it over', async () => {
    const dir = finishedCopy();
    const snapshot = () => readdirSync(out(dir)).sort().map((name) => [name, name.endsWith('.csv') || name.endsWith('.yaml') || name.endsWith('.json') ? readFileSync(join(out(dir), name), 'utf8') : '']);
    const before = snapshot();
    const smaller = CONFIG.replace('target: [sound], train', 'target: [sound], encoder: { hidden: [32] }, train');
    writeFileSync(join(dir, 'other.yaml'), smaller);
    const refused = await spawnWithFake(['run', join(dir, 'other.yaml')]);
    expect(refused.code).toBe(4);
    expect(lines(refused.stderr)).toEqual([
      `crosswise run: ${out(dir)} belongs to another experiment: learner 'sound-from-sight' has other settings there: learner.encoder.hidden: [32] here, [128,64] there. `
      + "Adding seeds, learners or vary values extends a sweep; changing the settings of existing ones is a new experiment: use another --out, or --force to take the folder over (only this config's cells are then read)",
    ]);
    expect(snapshot()).toEqual(before);

    writeFileSync(join(dir, 'more.yaml'), CONFIG.replace('seeds: [1, 2]', 'seeds: [1, 2, 3]').replace('noise:', '  - { name: untrained, objective: untrained, input: [sight] }\nnoise:'));
    const extended = await spawnWithFake(['run', join(dir, 'more.yaml'), '--jobs', '2']);
    expect(extended.code).toBe(0);
    expect(extended.stdout).toContain('9 cells, 4 already finished');
    const grown = lines(results(dir));
    expect(grown).toHaveLength(9 * 5 * (2 + 3) + 1);
    expect(lines(undisturbed).every((row) => grown.includes(row))).toBe(true);

    const forced = await spawnWithFake(['run', join(dir, 'other.yaml'), '--jobs', '2', '--force']);
    expect(forced.code).toBe(0);
    expect(lines(forced.stderr)).toEqual([`crosswise run: warning: ${out(dir)}: taken over with --force; only this config's cells are read from now on`]);
    // The autoencoder's cells are the same cells (same settings); the predictor's are new.
    expect(forced.stdout).toContain('4 cells, 2 already finished');
    const taken = lines(results(dir));
    expect(taken).toHaveLength(4 * 5 * (2 + 3) + 1);
    expect(taken.filter((row) => row.includes(',sight-autoencoder,'))).toEqual(lines(undisturbed).filter((row) => row.includes(',sight-autoencoder,')));
    expect(taken.filter((row) => row.includes(',sound-from-sight,')).some((row) => undisturbed.includes(row.split(',')[0]))).toBe(false);
  });

  it('refuses a folder of an older results format in run and report (exit 4), saying how to recompute', async () => {
    const dir = finishedCopy();
    unlinkSync(join(out(dir), 'experiment.json'));
    const refused = await run(dir);
    expect(refused.code).toBe(4);
    expect(lines(refused.stderr)).toEqual([`crosswise run: ${out(dir)} was written by an older crosswise (a results format before 3); this crosswise reads format 3 and does not reuse those cells. `
      + 'To recompute them, run the config again with --out <new folder> (or move this folder away, or --force to recompute into it)']);
    const errors = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      expect(await reportCommand([out(dir)])).toBe(4);
      expect(errors.mock.calls.map((call) => String(call[0]))).toEqual([expect.stringMatching(/^crosswise report: \S+ was written by an older crosswise \(a results format before 3\); .* --out <new folder>$/)]);
    } finally {
      errors.mockRestore();
    }
  });

  it('refuses a second runner on the same folder with exit 4, naming the first; the first finishes undisturbed', async () => {
    const dir = configFolder(CONFIG);
    let second: Promise<Finished> | undefined;
    let firstPid = 0;
    const first = spawnWithFake(['run', join(dir, 'config.yaml'), '--jobs', '2'], (line) => {
      if (second == null && line.includes('] start ')) second = run(dir);
    }, { FAKE_EPOCH_MS: '400' }, (child) => { firstPid = child.pid ?? 0; });
    const done = await first;
    const refused = await second!;
    expect(refused.code).toBe(4);
    expect(lines(refused.stderr)).toEqual([
      `crosswise run: ${out(dir)} is in use by another crosswise run (pid ${firstPid} on this machine, since ${lines(refused.stderr)[0].match(/since (\S+)\)/)?.[1]}); wait for it to finish or stop it`,
    ]);
    expect(refused.stdout).toBe('');
    expect(done.code).toBe(0);
    expect(results(dir)).toBe(undisturbed);
  });

  it('survives SIGKILLs at random moments: each rerun resumes, and the last gives the undisturbed results.csv', async () => {
    const dir = configFolder(CONFIG);
    const env = { FAKE_EPOCH_MS: '60' };
    // Kill points drawn from a fixed seed: after the k-th line of output (start, epoch or done lines).
    const rng = createRng(14, 'kill-points');
    for (let attempt = 0; attempt < 3; attempt++) {
      const killAt = 1 + randomInt(rng, 8);
      let seen = 0;
      const killed = await run(dir, [], env, (_, kill) => { if (++seen === killAt) kill(); });
      if (killed.code === 0) break;
      expect(killed.code).toBe(null);
      // Whatever is stored is complete: every cell folder is a whole cell.
      for (const name of folders(dir).filter((n) => !n.startsWith('.'))) expect(existsSync(cellFile(dir, name, 'cell.json'))).toBe(true);
    }
    const last = await run(dir, [], env);
    expect(last.code).toBe(0);
    // A killed run leaves its lock behind: the next run takes it over and says so, and says nothing else.
    for (const line of lines(last.stderr)) expect(line).toMatch(/^crosswise run: warning: \S+: took over the lock of a run that is gone \(pid \d+ on this machine, since \S+\)$/);
    expect(folders(dir).filter((name) => name.startsWith('.'))).toEqual([]);
    expect(readdirSync(out(dir)).filter((name) => name.includes('.partial-'))).toEqual([]);
    expect(results(dir)).toBe(undisturbed);
  });
});
