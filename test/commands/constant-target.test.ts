import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { checkCommand } from '../../src/commands/check.js';
import { planCommand } from '../../src/commands/plan.js';
import { configFolder } from '../experiment/helpers.js';

// The shed (test/experiment/helpers.ts) has one emitter, a clock, and one floor material.
const CONFIG = `name: constant
world: world.yaml
seeds: [1]
probe: { targets: [wall_ahead, nearest_emitter, material_under] }
learners:
  - { name: untrained, objective: untrained, input: [sight] }
out: out
`;

let out: string[];
let err: string[];
beforeEach(() => {
  out = [];
  err = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => { out.push(...line.split('\n')); });
  vi.spyOn(console, 'error').mockImplementation((line: string) => { err.push(...line.split('\n')); });
});
afterEach(() => vi.restoreAllMocks());

describe('a probe target that cannot vary in the chosen world', () => {
  const warnings = (command: string, config: string) => [
    `crosswise ${command}: ${config}:4:32: warning: probe.targets.1: nearest_emitter cannot vary in world 'shed' (world.yaml): `
      + "it is always 'clock' (the world has one emitter), so a probe has nothing to read out",
    `crosswise ${command}: ${config}:4:49: warning: probe.targets.2: material_under cannot vary in world 'shed' (world.yaml): `
      + "it is always 'floor' (every free cell is floor), so a probe has nothing to read out",
  ];

  it('check warns, one line per target, and still passes the config', async () => {
    const config = join(configFolder(CONFIG), 'config.yaml');
    expect(await checkCommand([config])).toBe(0);
    expect(err).toEqual(warnings('check', config));
    expect(out).toEqual([`${config}: ok (config, 2 warnings)`]);
  });

  it('plan warns and lists the cells, writing nothing', async () => {
    const dir = configFolder(CONFIG);
    const config = join(dir, 'config.yaml');
    expect(await planCommand([config])).toBe(0);
    expect(err).toEqual(warnings('plan', config));
    expect(out).toContain(`1 cell (1 combination × 1 seed × 1 learner); out ${join(dir, 'out')}`);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('does not warn about targets that vary', async () => {
    const config = join(configFolder(CONFIG.replace(', nearest_emitter, material_under', '')), 'config.yaml');
    expect(await checkCommand([config])).toBe(0);
    expect(err).toEqual([]);
  });
});
