import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { clusterCommand } from '../../src/commands/cluster.js';
import { planCommand } from '../../src/commands/plan.js';
import { schemaCommand } from '../../src/commands/schema.js';
import { readCellRecord } from '../../src/results/cell-record.js';
import { configFolder, spawnWithFake } from '../experiment/helpers.js';

const CONFIG = `name: commands
world: world.yaml
seeds: [1, 2]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], train: { epochs: 1 } }
  - { name: untrained, objective: untrained, input: [sight] }
vary:
  learners.*.encoder.hidden: [[8], [16, 8]]
out: out
`;

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
    const dir = configFolder(CONFIG);
    const lines = captureLog();
    expect(await planCommand([join(dir, 'config.yaml')])).toBe(0);
    expect(lines[0]).toBe('index  id          learner           seed  learners.*.encoder.hidden');
    expect(lines[1]).toMatch(/^0 {6}[0-9a-f]{10} {2}sound-from-sight {2}1 {5}\[8\]$/);
    expect(lines[8]).toMatch(/^7 {6}[0-9a-f]{10} {2}untrained {9}2 {5}\[16,8\]$/);
    // 2 vary combinations × 2 seeds × 2 learners = 8 cells.
    expect(lines[9]).toBe(`8 cells (2 combinations × 2 seeds × 2 learners); out ${join(dir, 'out')}`);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('cluster writes one job-array script with one task per cell and a report step', async () => {
    const dir = configFolder(CONFIG);
    const out = join(dir, 'cluster-out');
    captureLog();
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', out])).toBe(0);
    expect(readdirSync(out)).toEqual(['array-job.sh']);
    const script = readFileSync(join(out, 'array-job.sh'), 'utf8');
    expect(script).toContain('#SBATCH --array=0-7\n');
    expect(script).toContain('cell "$CONFIG" --index "$SLURM_ARRAY_TASK_ID" --out "$OUT"');
    expect(script).toContain('report \\"$OUT\\"');
    expect(statSync(join(out, 'array-job.sh')).mode & 0o111).not.toBe(0);
    execFileSync('bash', ['-n', join(out, 'array-job.sh')]); // throws on a syntax error
  });

  it('cluster reports a folder it cannot create in one line and exits 5 (a write failed)', async () => {
    const dir = configFolder(CONFIG);
    const errors: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((text: string) => { errors.push(text); });
    // config.yaml is a file, so no folder can be made beneath it.
    expect(await clusterCommand([join(dir, 'config.yaml'), '--out', join(dir, 'config.yaml', 'out')])).toBe(5);
    expect(errors).toEqual([`crosswise cluster: cannot write ${join(dir, 'config.yaml', 'out')}: ENOTDIR: not a directory (mkdir)`]);
  });

  it('cluster requires --out', async () => {
    const dir = configFolder(CONFIG);
    const errors: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((text: string) => { errors.push(text); });
    expect(await clusterCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(errors).toEqual(['crosswise cluster: --out DIR is required (a folder every cluster node can reach)']);
  });

  it('cell runs exactly the cell at --index and rejects an index outside the plan', async () => {
    const dir = configFolder(CONFIG);
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
});
