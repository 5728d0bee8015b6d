import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { clusterCommand } from '../../src/commands/cluster.js';
import { planCommand } from '../../src/commands/plan.js';
import { schemaCommand } from '../../src/commands/schema.js';
import { readCellRecord } from '../../src/results/cell-record.js';
import { configFolder, spawnWithFake } from '../experiment/helpers.js';
import { EIGHT_CELLS, FAILURE, plannedIds, storeCells } from './cluster-helpers.js';

function captureLog(): string[] {
  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((text: string) => { lines.push(...String(text).split('\n')); });
  return lines;
}

describe('experiment commands', () => {
  afterEach(() => vi.restoreAllMocks());

  it('schema prints the config JSON Schema as valid JSON', async () => {
    const lines = captureLog();
    expect(await schemaCommand([])).toBe(0);
    const schema = JSON.parse(lines.join('\n')) as { $schema: string; properties: Record<string, unknown>; required: string[]; additionalProperties: boolean };
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(Object.keys(schema.properties)).toEqual(['name', 'world', 'seeds', 'backend', 'collect', 'senses', 'learners', 'probe', 'noise', 'vary', 'out']);
    expect(schema.required).toEqual(['name', 'world', 'learners']);
    expect(schema.additionalProperties).toBe(false);
  });

  it('plan lists index, id, learner, seed and vary values, and writes nothing', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const lines = captureLog();
    expect(await planCommand([join(dir, 'config.yaml')])).toBe(0);
    expect(lines[0]).toBe('index  id          learner           seed  learners.*.encoder.hidden');
    expect(lines[1]).toMatch(/^0 {6}[0-9a-f]{10} {2}sound-from-sight {2}1 {5}\[8\]$/);
    expect(lines[8]).toMatch(/^7 {6}[0-9a-f]{10} {2}untrained {9}2 {5}\[16,8\]$/);
    // 2 vary combinations × 2 seeds × 2 learners = 8 cells.
    expect(lines[9]).toBe(`8 cells (2 combinations × 2 seeds × 2 learners); out ${join(dir, 'out')}`);
    // The first learner is the baseline and untrained is a control by default.
    expect(lines[10]).toBe('Power: the primary family is empty: every learner other than the baseline is a control, so every comparison is exploratory.');
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('plan states what the primary family can detect: 1 learner × 3 targets × 2 noises with 9 seeds', async () => {
    const dir = configFolder(`name: power
world: world.yaml
seeds: [1, 2, 3, 4, 5, 6, 7, 8, 9]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound] }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight] }
  - { name: untrained, objective: untrained, input: [sight] }
probe: { targets: [wall_ahead, heading, nearest_emitter], baseline: sight-autoencoder }
noise:
  - { channel: sight, kind: gaussian }
  - { channel: sight, kind: dropout }
`);
    const lines = captureLog();
    expect(await planCommand([join(dir, 'config.yaml')])).toBe(0);
    // m = 6, α = 0.05/6, n = 9: d_z 1.49 and 16 seeds for d_z = 1 (noncentral t, src/stats/power.ts, checked against SciPy there).
    expect(lines.at(-1)).toBe("Power: the primary family has 6 hypotheses (1 learner × 3 targets × 2 noises). With 9 seeds, a two-sided paired "
      + "t-test at Holm's first step (α = 0.05/6) detects d_z ≥ 1.49 with 80% power; d_z = 1 would need 16 seeds.");
  });

  it('cluster reports a folder it cannot create in one line and exits 5 (a write failed)', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const errors: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((text: string) => { errors.push(text); });
    // config.yaml is a file, so no folder can be made beneath it.
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', join(dir, 'config.yaml', 'out')])).toBe(5);
    expect(errors).toEqual([`crosswise cluster: cannot write ${join(dir, 'config.yaml', 'out', 'cells')}: ENOTDIR (mkdir)`]);
  });

  it('cluster requires --out', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const errors: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((text: string) => { errors.push(text); });
    expect(await clusterCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(errors).toEqual(['crosswise cluster: --out DIR is required (a folder every cluster node can reach)']);
  });

  it('cell runs exactly the cell at --index and rejects an index outside the plan', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const run = await spawnWithFake(['cell', join(dir, 'config.yaml'), '--index', '3']);
    expect(run.code).toBe(0);
    const cells = readdirSync(join(dir, 'out', 'cells'));
    expect(cells).toHaveLength(1);
    const record = readCellRecord(join(dir, 'out'), cells[0]);
    expect([record.index, record.identity.learner.name, record.identity.seed]).toEqual([3, 'untrained', 2]);
    const wrong = await spawnWithFake(['cell', join(dir, 'config.yaml'), '--index', '8']);
    expect(wrong.code).toBe(1);
    expect(wrong.stderr.trim()).toBe("crosswise cell: --index: expected a whole number from 0 to 7, got '8'");
  });

  it('cell leaves a failed cell as it is (exit 3) unless --retry-failed, which computes it again', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const [config, out] = [join(dir, 'config.yaml'), join(dir, 'out')];
    await storeCells(config, out, { failed: [3] });
    const id = plannedIds(config)[3];
    const kept = await spawnWithFake(['cell', config, '--index', '3']);
    expect([kept.code, kept.stdout]).toEqual([3, `cell 3 (${id}) failed before (${FAILURE}); add --retry-failed to run it again\n`]);
    expect(readCellRecord(out, id).status).toBe('failed');
    const retried = await spawnWithFake(['cell', config, '--index', '3', '--retry-failed']);
    expect(retried.code).toBe(0);
    expect([readCellRecord(out, id).status, readCellRecord(out, id).reason]).toEqual(['done', '']);
    expect(readdirSync(join(out, 'cells'))).toEqual([id]); // the failed folder is gone, no temporary one left
  });

  it('cell takes no lock: tasks of one array run at once in one folder, even two on the same cell', async () => {
    const dir = configFolder(EIGHT_CELLS);
    const config = join(dir, 'config.yaml');
    const runs = await Promise.all(['0', '1', '1'].map((index) => spawnWithFake(['cell', config, '--index', index], undefined, { FAKE_EPOCH_MS: '300' })));
    expect(runs.map((run) => [run.code, run.stderr])).toEqual([[0, ''], [0, ''], [0, '']]);
    expect(readdirSync(join(dir, 'out', 'cells')).sort()).toEqual(plannedIds(config).slice(0, 2).sort());
  });
});
