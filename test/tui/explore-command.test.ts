import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { exploreCommand, parseExploreArgs } from '../../src/commands/explore.js';
import { checkConfigFile } from '../../src/experiment/config.js';
import { checkWorldFile } from '../../src/world/parse.js';

afterEach(() => { vi.restoreAllMocks(); });

describe('explore command line', () => {
  it('takes a world path and a seed', () => {
    expect(parseExploreArgs(['w.yaml', '--seed', '0'])).toEqual({ world: 'w.yaml', config: null, seed: 0 });
  });

  it('takes a config instead of a world', () => {
    expect(parseExploreArgs(['--config', 'c.yaml'])).toEqual({ world: null, config: 'c.yaml', seed: 1 });
  });

  it('defaults to the greenhouse demo world and seed 1', () => {
    const parsed = parseExploreArgs([]);
    expect('world' in parsed && parsed.world?.endsWith('worlds/greenhouse.yaml') === true && parsed.seed === 1).toBe(true);
  });

  it('rejects a seed that is not an integer, an unknown option and a second world in one line each', () => {
    expect(parseExploreArgs(['--seed', '1.5'])).toEqual({ error: 'explore: --seed needs an integer, got 1.5' });
    const usage = 'usage: crosswise explore [world | --config FILE] [--seed N]';
    expect(parseExploreArgs(['--sed', '2'])).toEqual({ error: `explore: unknown option '--sed'; ${usage}` });
    expect(parseExploreArgs(['a.yaml', 'b.yaml'])).toEqual({ error: `explore: one world at a time, got 'a.yaml' and 'b.yaml'; ${usage}` });
    expect(parseExploreArgs(['a.yaml', '--config', 'c.yaml'])).toEqual({ error: `explore: give a world or --config, not both; ${usage}` });
  });

  it('prints the same one-line problems as the world check, before any screen, and exits 1', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'crosswise-explore-')), 'broken.yaml');
    writeFileSync(path, 'name: broken\ncell_size_m: -1\nmaterials: []\nemitters: []\nmap: |\n  #?#\n');
    const printed: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((line: string) => { printed.push(line); });
    expect(await exploreCommand([path])).toBe(1);
    expect(printed.length).toBeGreaterThan(0);
    expect(printed).toEqual(checkWorldFile(path));
    expect(printed.every((line) => line.startsWith(`${path}:`) && !line.includes('\n'))).toBe(true);
  });

  it('prints a config\'s problems as the config loader words them, before any screen, and exits 1', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'crosswise-explore-')), 'bad.yaml');
    writeFileSync(path, 'name: bad\nworld: ../nowhere.yaml\nsenses: { sound: { bands: 0 } }\nlearners: [{ name: a, objective: untrained, input: [sight] }]\n');
    const printed: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((line: string) => { printed.push(line); });
    expect(await exploreCommand(['--config', path])).toBe(1);
    expect(printed).toEqual(checkConfigFile(path));
    expect(printed.some((line) => line.startsWith(`${path}:3:`) && line.includes('senses.sound.bands'))).toBe(true);
  });
});
