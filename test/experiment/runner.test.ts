import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { FAKE_WORK, configFolder, spawnWithFake, type Finished } from './helpers.js';
import { loadSweep } from '../../src/experiment/config.js';
import { runSweep } from '../../src/experiment/runner.js';
import { planCells } from '../../src/experiment/plan.js';
import type { RunEvent } from '../../src/experiment/events.js';
import { readCellRecord } from '../../src/results/cell-record.js';

const CONFIG = `name: runner
world: world.yaml
seeds: [1, 2]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], train: { epochs: 3 } }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight], train: { epochs: 2 } }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 4] }
vary:
  collect.steps: [1000, 2000]
out: out
`;

const DIVERGING = CONFIG.replace("{ name: sight-autoencoder", "{ name: sight-diverge");

function cellFolders(out: string): string[] {
  return readdirSync(join(out, 'cells')).sort();
}

describe('crosswise run (with a test double for the cell work)', () => {
  let one: string;
  let two: string;
  let runs: Finished[];
  beforeAll(async () => {
    one = configFolder(CONFIG);
    two = configFolder(CONFIG);
    runs = await Promise.all([
      spawnWithFake(['run', join(one, 'config.yaml'), '--jobs', '1']),
      spawnWithFake(['run', join(two, 'config.yaml'), '--jobs', '2']),
    ]);
  });

  it('stores the same results.csv with --jobs 1 and --jobs 2', () => {
    expect(runs.map((run) => run.code)).toEqual([0, 0]);
    const results = readFileSync(join(one, 'out', 'results.csv'), 'utf8');
    expect(results).toBe(readFileSync(join(two, 'out', 'results.csv'), 'utf8'));
    // 8 cells × 5 targets × (3 severities + the per-seed noisy, drop and area), plus the header.
    expect(results.trim().split('\n')).toHaveLength(8 * 5 * (3 + 3) + 1);
    expect(results.split('\n')[0]).toBe('cell,learner,objective,rule,seed,target,channel,kind,severity,parameter,measure,metric,value,collect.steps');
  });

  it('writes the same summary.md and comparisons.csv whatever order the cells finished in', () => {
    for (const file of ['summary.md', 'comparisons.csv']) {
      expect(readFileSync(join(one, 'out', file), 'utf8')).toBe(readFileSync(join(two, 'out', file), 'utf8'));
    }
  });

  it('writes config.resolved.yaml, and cell.json and train.csv for every cell', () => {
    const out = join(two, 'out');
    const cells = cellFolders(out);
    expect(cells).toHaveLength(8);
    const record = JSON.parse(readFileSync(join(out, 'cells', cells[0], 'cell.json'), 'utf8')) as Record<string, unknown>;
    expect(record.status).toBe('done');
    expect(Object.keys(record.seconds as object)).toEqual(['collect', 'train', 'probe', 'total']);
    expect(Object.keys(record.versions as object)).toEqual(['node', 'crosswise', 'fake']);
    expect(readFileSync(join(out, 'cells', cells[0], 'train.csv'), 'utf8').split('\n')[0]).toBe('epoch,train_loss,validation_loss,seconds');
    // The resolved config is itself a valid config reproducing the same cells.
    const resolved = loadSweep(join(out, 'config.resolved.yaml'));
    expect(resolved.out).toBe(out);
    expect(resolved.filled.collect.episode_steps).toBe(200);
    expect(planCells(resolved).map((cell) => cell.id)).toEqual(planCells(loadSweep(join(two, 'config.yaml'))).map((cell) => cell.id));
  });

  it('prints plain lines without terminal escape codes when stdout is not a terminal', () => {
    const { stdout } = runs[1];
    // 1 sweep-start + 8 × (start, done) + 20 epoch lines + 1 sweep-done.
    expect(stdout.trim().split('\n')).toHaveLength(1 + 16 + 20 + 1);
    expect(stdout.includes(String.fromCharCode(0x1b))).toBe(false); // ESC starts every ANSI sequence
    expect(stdout.split('\n')[1]).toMatch(/^\[1\/8\] start sound-from-sight seed 1 collect\.steps=1000 \([0-9a-f]{10}\) on worker [12]$/);
  });

  it('stores a failing cell as failed with its reason, finishes the others and exits with 3', async () => {
    const dir = configFolder(DIVERGING);
    const run = await spawnWithFake(['run', join(dir, 'config.yaml'), '--jobs', '2']);
    expect(run.code).toBe(3);
    const out = join(dir, 'out');
    const records = cellFolders(out).map((id) => readCellRecord(out, id));
    expect(records.filter((r) => r.status === 'done').map((r) => r.identity.learner.name)).toEqual(Array(4).fill('sound-from-sight'));
    expect(records.filter((r) => r.status === 'failed').map((r) => r.reason)).toEqual(Array(4).fill('LearnerDivergedError: loss became NaN at epoch 1'));
    expect(readFileSync(join(out, 'results.csv'), 'utf8').trim().split('\n')).toHaveLength(4 * 5 * (3 + 3) + 1);
    expect(run.stdout).toMatch(/sweep done: 4 done, 4 failed/);
  });

  it('resumes after a kill and ends with the same results as an uninterrupted run', async () => {
    const env = { FAKE_EPOCH_MS: '150' };
    const killed = configFolder(CONFIG);
    const first = spawnWithFake(['run', join(killed, 'config.yaml'), '--jobs', '2'], (line, kill) => {
      if (line.includes('] done ')) kill();
    }, env);
    const interrupted = await first;
    expect(interrupted.code).toBe(null);
    const finished = cellFolders(join(killed, 'out')).filter((name) => existsSync(join(killed, 'out', 'cells', name, 'cell.json')));
    expect(finished.length).toBeGreaterThanOrEqual(1);
    expect(finished.length).toBeLessThan(8);
    const resumed = await spawnWithFake(['run', join(killed, 'config.yaml'), '--jobs', '2'], undefined, env);
    expect(resumed.code).toBe(0);
    expect(resumed.stdout).toContain(`8 cells, ${finished.length} already finished`);
    expect(cellFolders(join(killed, 'out')).filter((name) => name.startsWith('.'))).toEqual([]);
    expect(readFileSync(join(killed, 'out', 'results.csv'), 'utf8')).toBe(readFileSync(join(one, 'out', 'results.csv'), 'utf8'));
  });

  it('stops on Ctrl-C, letting running cells finish, and says how to resume', async () => {
    const dir = configFolder(CONFIG);
    const config = join(dir, 'config.yaml');
    let child: { kill: (signal: NodeJS.Signals) => void } | undefined;
    const run = spawnWithFake(['run', config, '--jobs', '2'], (line) => {
      if (line.includes('] done ')) child?.kill('SIGINT');
    }, { FAKE_EPOCH_MS: '150' }, (spawned) => { child = spawned; });
    const stopped = await run;
    expect(stopped.code).toBe(130);
    expect(stopped.stdout).toContain(`resume with: crosswise run ${config}`);
    const names = cellFolders(join(dir, 'out'));
    expect(names.every((name) => existsSync(join(dir, 'out', 'cells', name, 'cell.json')))).toBe(true);
    expect(names.length).toBeLessThan(8);
    // The first Ctrl-C lets the cells already running finish: each stored cell was announced done.
    expect(stopped.stdout).toContain('stopping: running cells finish first (Ctrl-C again to abandon them)');
    expect(stopped.stdout.split('\n').filter((line) => line.includes('] done ')).length).toBe(names.length);
  });
});

describe('runSweep', () => {
  it('streams events in order for each cell: start, epochs, done', async () => {
    const dir = configFolder(CONFIG.replace('seeds: [1, 2]', 'seeds: [1]').replace(/vary:\n.*\n/, ''));
    const events: RunEvent[] = [];
    const outcome = await runSweep(loadSweep(join(dir, 'config.yaml')), { jobs: 2, workModule: FAKE_WORK, listeners: [(event) => events.push(event)] });
    expect(outcome).toEqual({ done: 2, failed: 0, interrupted: false, writeFailures: [] });
    const forCell = (index: number) => events.filter((e) => 'cell' in e && e.cell.index === index).map((e) => e.type);
    expect(forCell(0)).toEqual(['cell-start', 'epoch', 'epoch', 'epoch', 'cell-done']);
    expect(forCell(1)).toEqual(['cell-start', 'epoch', 'epoch', 'cell-done']);
    expect(events[0].type).toBe('sweep-start');
    expect(events[events.length - 1]).toMatchObject({ type: 'sweep-done', done: 2, failed: 0, interrupted: false });
  });
});
