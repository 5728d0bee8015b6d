import { readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { parse } from 'yaml';
import { runCommand } from '../../src/commands/run.js';
import { loadSweep } from '../../src/experiment/config.js';
import { resolvedConfigYaml } from '../../src/experiment/resolved-yaml.js';
import { configFolder, FAKE_WORK } from './helpers.js';

const CONFIG = `name: where
world: world.yaml
seeds: [1]
collect: { steps: 200, episode_steps: 100 }
probe: { targets: [wall_ahead] }
learners:
  - { name: untrained, objective: untrained, input: [sight], train: { epochs: 1 } }
`;

describe('where a sweep writes', () => {
  afterEach(() => vi.restoreAllMocks());

  it('puts runs/<name> beside the config file when it names no out, from any working directory', () => {
    const dir = configFolder(CONFIG);
    expect(loadSweep(join(dir, 'config.yaml')).out).toBe(join(dir, 'runs', 'where'));
    // The same file named relative to the working directory (the repository, not its folder).
    expect(loadSweep(relative(process.cwd(), join(dir, 'config.yaml'))).out).toBe(join(dir, 'runs', 'where'));
  });

  it('resolves out: relative to the config file too', () => {
    const dir = configFolder(`${CONFIG}out: ../elsewhere\n`);
    expect(loadSweep(join(dir, 'config.yaml')).out).toBe(join(dir, '..', 'elsewhere'));
  });

  it('says where it writes on its first line', async () => {
    const dir = configFolder(CONFIG);
    const lines: string[] = [];
    vi.spyOn(console, 'log').mockImplementation((line: string) => { lines.push(line); });
    vi.spyOn(console, 'error').mockImplementation(() => undefined);
    expect(await runCommand([join(dir, 'config.yaml'), '--plain', '--jobs', '1'], { workModule: FAKE_WORK })).toBe(0);
    expect(lines[0]).toBe(`sweep where: writing to ${join(dir, 'runs', 'where')}; 1 cell, 0 already finished, 1 job`);
  });

  it('keeps an absolute world path absolute in config.resolved.yaml, and makes a relative one relative to the output folder', () => {
    const dir = configFolder(CONFIG);
    const absolute = loadSweep(join(configFolder(CONFIG.replace('world: world.yaml', `world: ${join(dir, 'world.yaml')}`)), 'config.yaml'));
    expect(parse(resolvedConfigYaml(absolute)).world).toBe(join(dir, 'world.yaml'));
    const relativeWorld = loadSweep(join(dir, 'config.yaml'));
    expect(parse(resolvedConfigYaml(relativeWorld)).world).toBe('../../world.yaml');
  });

  it('writes config.resolved.yaml that loads back to the same output folder and world', async () => {
    const dir = configFolder(CONFIG);
    vi.spyOn(console, 'log').mockImplementation(() => undefined);
    vi.spyOn(console, 'error').mockImplementation(() => undefined);
    expect(await runCommand([join(dir, 'config.yaml'), '--plain', '--jobs', '1'], { workModule: FAKE_WORK })).toBe(0);
    const resolvedPath = join(dir, 'runs', 'where', 'config.resolved.yaml');
    expect(readFileSync(resolvedPath, 'utf8')).toContain('world: ../../world.yaml\n');
    const again = loadSweep(resolvedPath);
    expect([again.out, again.combinations[0].settings.worldPath]).toEqual([join(dir, 'runs', 'where'), join(dir, 'world.yaml')]);
  });
});
