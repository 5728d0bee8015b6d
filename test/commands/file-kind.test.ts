import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { checkCommand } from '../../src/commands/check.js';
import { planCommand } from '../../src/commands/plan.js';
import { recordCommand } from '../../src/commands/record.js';
import { runCommand } from '../../src/commands/run.js';
import { senseCommand } from '../../src/commands/sense.js';
import { fileKind } from '../../src/experiment/file-kind.js';
import { configFolder, FAKE_WORK, SHED_WORLD } from '../experiment/helpers.js';

const CONFIG = `name: kinds
world: world.yaml
seeds: [1]
collect: { steps: 1000, episode_steps: 100 }
learners:
  - { name: untrained, objective: untrained, input: [sight] }
`;

let err: string[];
beforeEach(() => {
  err = [];
  vi.spyOn(console, 'error').mockImplementation((line: string) => { err.push(...line.split('\n')); });
  vi.spyOn(console, 'log').mockImplementation(() => undefined);
});
afterEach(() => vi.restoreAllMocks());

describe('a file is a world or a config by its content', () => {
  it('counts the top-level keys only one kind has', () => {
    expect(fileKind(SHED_WORLD)).toBe('world');
    expect(fileKind(CONFIG)).toBe('config');
    // Shared or unknown keys alone decide nothing.
    expect(fileKind('name: x\ntitle: y\n')).toBeNull();
    expect(fileKind('- a\n- b\n')).toBeNull();
  });

  it('still knows a config by its keys when one is written twice', () => {
    expect(fileKind(CONFIG.replace('steps: 1000,', 'steps: 1000, steps: 500,'))).toBe('config');
  });

  it('check reports a config key written twice as a config problem, at its second place, as plan does', async () => {
    const dir = configFolder(CONFIG.replace('steps: 1000,', 'steps: 1000, steps: 500,'));
    const config = join(dir, 'config.yaml');
    const line = `${config}:4:25: collect.steps: the key is written twice (first at line 4, column 12); keep one`;
    expect(await checkCommand([config])).toBe(1);
    expect(await planCommand([config])).toBe(1);
    expect(err).toEqual([`crosswise check: ${line}`, `crosswise plan: ${line}`]);
  });

  it('a config command given a world says "this is a world, not a config"', async () => {
    const dir = configFolder(CONFIG);
    const world = join(dir, 'world.yaml');
    expect(await runCommand([world, '--plain', '--out', join(dir, 'out')], { workModule: FAKE_WORK })).toBe(1);
    expect(err).toEqual([
      `crosswise run: ${world}:1:1: this is a world, not a config (a config has 'learners' and names a world file under 'world')`,
    ]);
  });

  it('a world command given a config says "this is a config, not a world" and what to do instead', async () => {
    const dir = configFolder(CONFIG);
    const config = join(dir, 'config.yaml');
    expect(await senseCommand([config, '--at', '1,1,east'])).toBe(1);
    expect(err).toEqual([
      `crosswise sense: ${config}:1:1: this is a config, not a world (a world has 'map', 'materials' and 'emitters'; `
        + "a config names its world under 'world'); give a config with --config to use its world and senses",
    ]);
  });

  it('record given a config says "this is a config, not a world" and how to record a cell, writing nothing', async () => {
    const dir = configFolder(CONFIG);
    const config = join(dir, 'config.yaml');
    expect(await recordCommand([config, '--out', join(dir, 'rec')])).toBe(1);
    expect(err).toEqual([
      `crosswise record: ${config}:1:1: this is a config, not a world (a world has 'map', 'materials' and 'emitters'; `
        + "a config names its world under 'world'); record a cell of a config with --config FILE --index I",
    ]);
    expect(existsSync(join(dir, 'rec'))).toBe(false);
  });

  it('a config whose world key names a config says so at that key', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-kind-'));
    writeFileSync(join(dir, 'other.yaml'), CONFIG);
    writeFileSync(join(dir, 'config.yaml'), CONFIG.replace('world: world.yaml', 'world: other.yaml'));
    expect(await checkCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(err).toEqual([
      `crosswise check: ${dir}/config.yaml:2:8: world: the world file ${dir}/other.yaml is invalid (1 problem, listed below)`,
      `crosswise check: ${dir}/other.yaml:1:1: this is a config, not a world (a world has 'map', 'materials' and 'emitters'; a config names its world under 'world')`,
    ]);
  });
});
