import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { exploreCommand } from '../../src/commands/explore.js';
import { checkWorldFile } from '../../src/world/parse.js';

afterEach(() => { vi.restoreAllMocks(); });

describe('explore command line', () => {
  it('rejects a seed that is not an integer, an unknown option and a second world in one line each, exit 1', async () => {
    const printed: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((line: string) => { printed.push(line); });
    expect(await exploreCommand(['--seed', '1.5'])).toBe(1);
    expect(await exploreCommand(['--sed', '2'])).toBe(1);
    expect(await exploreCommand(['a.yaml', 'b.yaml'])).toBe(1);
    expect(printed).toEqual([
      "crosswise explore: --seed: expected a whole number, got '1.5'",
      "crosswise explore: unknown option '--sed' (did you mean '--seed'?); see crosswise explore --help",
      "crosswise explore: unexpected argument 'b.yaml' (usage: crosswise explore [world] [--seed N])",
    ]);
  });

  it('prints the same one-line problems as the world check, before any screen, and exits 1', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'crosswise-explore-')), 'broken.yaml');
    writeFileSync(path, 'name: broken\ncell_size_m: -1\nmaterials: []\nemitters: []\nmap: |\n  #?#\n');
    const printed: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((line: string) => { printed.push(line); });
    expect(await exploreCommand([path])).toBe(1);
    expect(printed.length).toBeGreaterThan(0);
    expect(printed).toEqual(checkWorldFile(path).map((problem) => `crosswise explore: ${problem}`));
    expect(printed.every((line) => line.startsWith(`crosswise explore: ${path}:`) && !line.includes('\n'))).toBe(true);
  });
});
