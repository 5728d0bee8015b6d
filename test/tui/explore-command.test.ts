import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { exploreCommand, parseExploreArgs } from '../../src/commands/explore.js';
import { checkWorldFile } from '../../src/world/parse.js';

afterEach(() => { vi.restoreAllMocks(); });

describe('explore command line', () => {
  it('takes a world path and a seed', () => {
    expect(parseExploreArgs(['w.yaml', '--seed', '0'])).toEqual({ world: 'w.yaml', seed: 0 });
  });

  it('defaults to the greenhouse demo world and seed 1', () => {
    const parsed = parseExploreArgs([]);
    expect('world' in parsed && parsed.world.endsWith('worlds/greenhouse.yaml') && parsed.seed === 1).toBe(true);
  });

  it('rejects a seed that is not an integer, an unknown option and a second world in one line each', () => {
    expect(parseExploreArgs(['--seed', '1.5'])).toEqual({ error: 'explore: --seed needs an integer, got 1.5' });
    expect(parseExploreArgs(['--sed', '2'])).toEqual({ error: "explore: unknown option '--sed'; usage: crosswise explore [world] [--seed N]" });
    expect(parseExploreArgs(['a.yaml', 'b.yaml'])).toEqual({ error: "explore: one world at a time, got 'a.yaml' and 'b.yaml'; usage: crosswise explore [world] [--seed N]" });
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
});
