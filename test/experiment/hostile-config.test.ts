// Configs built to hurt: each names the fault and expects one located line, exit code 1
// and nothing written. The limits are those of src/input-limits.ts (README, "Limits").
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi, type MockInstance } from 'vitest';
import { cellCommand } from '../../src/commands/cell.js';
import { checkCommand } from '../../src/commands/check.js';
import { planCommand } from '../../src/commands/plan.js';
import { runCommand } from '../../src/commands/run.js';
import { FAKE_WORK, configFolder } from './helpers.js';

const CONFIG = `name: hostile
world: world.yaml
seeds: [1]
learners:
  - { name: untrained, objective: untrained, input: [sight] }
out: out
`;

/** A "billion laughs" document: each anchor lists the previous one nine times, 9^5 scalars in all. */
const ALIAS_BOMB = `notes:
  a: &a [x, x, x, x, x, x, x, x, x]
  b: &b [*a, *a, *a, *a, *a, *a, *a, *a, *a]
  c: &c [*b, *b, *b, *b, *b, *b, *b, *b, *b]
  d: &d [*c, *c, *c, *c, *c, *c, *c, *c, *c]
  e: [*d, *d, *d, *d, *d, *d, *d, *d, *d]
`;

describe('hostile configs', () => {
  let errors: MockInstance<typeof console.error>;
  let output: MockInstance<typeof console.log>;
  beforeEach(() => {
    errors = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    output = vi.spyOn(console, 'log').mockImplementation(() => undefined);
  });
  afterEach(() => vi.restoreAllMocks());
  const errorLines = () => errors.mock.calls.map((call) => String(call[0]));

  it('refuses an alias bomb with one line at the alias that brings in other aliases, and writes nothing', async () => {
    const dir = configFolder(`${CONFIG}${ALIAS_BOMB}`);
    expect(await runCommand([join(dir, 'config.yaml')], { workModule: FAKE_WORK })).toBe(1);
    // Line 10 is `c: &c [*b, ...]`: *b is the first alias whose anchored list holds aliases itself.
    expect(errorLines()).toEqual([`crosswise run: ${join(dir, 'config.yaml')}:10:10: (YAML): an alias here expands to more than 100 nodes (aliases of aliases; see "Limits" in the README)`]);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('refuses a config file larger than 256 KiB before reading it', async () => {
    const dir = configFolder(`${CONFIG}# ${'padding '.repeat(40_000)}\n`);
    expect(await checkCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(await planCommand([join(dir, 'config.yaml')])).toBe(1);
    const refusal = `${join(dir, 'config.yaml')}:1:1: the config file is 320127 bytes; at most 262144 are read (see "Limits" in the README)`;
    expect(errorLines()).toEqual([`crosswise check: ${refusal}`, `crosswise plan: ${refusal}`]);
  });

  it('refuses nesting deeper than 64 levels with one located line (100,000 brackets once exhausted the heap)', async () => {
    const dir = configFolder(`${CONFIG}notes: ${'['.repeat(100_000)}${']'.repeat(100_000)}\n`);
    expect(await planCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(errorLines()).toEqual([`crosswise plan: ${join(dir, 'config.yaml')}:7:71: nested more than 64 levels deep (see "Limits" in the README)`]);
  });

  it('refuses a sweep of more than 10,000 cells before expanding it, at its vary key', async () => {
    const steps = Array.from({ length: 400 }, (_, i) => 1000 + i).join(', ');
    const seeds = Array.from({ length: 1000 }, (_, i) => i + 1).join(', ');
    const dir = configFolder(CONFIG.replace('seeds: [1]', `seeds: [${seeds}]`) + `vary:\n  collect.steps: [${steps}]\n`);
    expect(await planCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(errorLines()).toEqual([`crosswise plan: ${join(dir, 'config.yaml')}:7:1: vary: the sweep has 400000 cells (400 vary combinations × 1000 seeds × 1 learner); `
      + 'at most 10000 are run from one config (see "Limits" in the README): split it into several configs']);
  });

  it('plans the largest sweep allowed, 10,000 cells, one line each (its table once overflowed the stack)', async () => {
    const seeds = Array.from({ length: 100 }, (_, i) => i + 1).join(', ');
    const steps = Array.from({ length: 100 }, (_, i) => 1000 + i).join(', ');
    const dir = configFolder(CONFIG.replace('seeds: [1]', `seeds: [${seeds}]`) + `vary:\n  collect.steps: [${steps}]\n`);
    expect(await planCommand([join(dir, 'config.yaml')])).toBe(0);
    const printed = output.mock.calls.map((call) => String(call[0]));
    // The table (a header and 10,000 rows) is one printed block, then the count line.
    expect(printed[0].split('\n')).toHaveLength(10_001);
    expect(printed[1]).toMatch(/^10000 cells \(100 combinations × 100 seeds × 1 learner\); out /);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('writes nothing for an index outside the plan: no output folder, no config.resolved.yaml', async () => {
    const dir = configFolder(CONFIG);
    expect(await cellCommand([join(dir, 'config.yaml'), '--index', '99'], FAKE_WORK)).toBe(1);
    expect(errorLines()).toEqual(["crosswise cell: --index: expected a whole number from 0 to 0, got '99'"]);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('writes nothing for a world whose number is not finite, and says what the number was', async () => {
    const dir = configFolder(CONFIG);
    const world = join(dir, 'world.yaml');
    writeFileSync(world, readFileSync(world, 'utf8').replace('cell_size_m: 0.5', 'cell_size_m: .nan'));
    expect(await runCommand([join(dir, 'config.yaml')], { workModule: FAKE_WORK })).toBe(1);
    expect(errorLines()).toContain(`crosswise run: ${world}:3:14: cell_size_m: expected a number > 0 and <= 100, got .nan (not a finite number)`);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });
});
