import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { exploreCommand } from '../../src/commands/explore.js';
import { recordCommand } from '../../src/commands/record.js';
import { checkConfigFile } from '../../src/experiment/config.js';
import { checkWorldFile } from '../../src/world/parse.js';

afterEach(() => { vi.restoreAllMocks(); });

/** What `crosswise explore` prints on stderr for each command line, all expected to exit 1. */
async function rejections(...lines: (readonly string[])[]): Promise<string[]> {
  const printed: string[] = [];
  vi.spyOn(console, 'error').mockImplementation((line: string) => { printed.push(line); });
  for (const args of lines) expect(await exploreCommand(args)).toBe(1);
  return printed;
}

describe('explore command line', () => {
  it('rejects a seed that is not an integer, an unknown option, a second world, and a world with --config, one line each', async () => {
    const usage = 'usage: crosswise explore ([world] | --config FILE | --replay DIR) [--seed N]';
    expect(await rejections(['--seed', '1.5'], ['--sed', '2'], ['a.yaml', 'b.yaml'], ['a.yaml', '--config', 'c.yaml'])).toEqual([
      "crosswise explore: --seed: expected a whole number, got '1.5'",
      "crosswise explore: unknown option '--sed' (did you mean '--seed'?); see crosswise explore --help",
      `crosswise explore: unexpected argument 'b.yaml' (${usage})`,
      `crosswise explore: give only one of <world>, --config FILE, --replay DIR (${usage})`,
    ]);
  });

  it('prints the same one-line problems as the world check, before any screen, and exits 1', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'crosswise-explore-')), 'broken.yaml');
    writeFileSync(path, 'name: broken\ncell_size_m: -1\nmaterials: []\nemitters: []\nmap: |\n  #?#\n');
    const printed = await rejections([path]);
    expect(printed.length).toBeGreaterThan(0);
    expect(printed).toEqual(checkWorldFile(path).map((problem) => `crosswise explore: ${problem}`));
    expect(printed.every((line) => line.startsWith(`crosswise explore: ${path}:`) && !line.includes('\n'))).toBe(true);
  });

  it('prints a config\'s problems as the config loader words them, before any screen, and exits 1', async () => {
    const path = join(mkdtempSync(join(tmpdir(), 'crosswise-explore-')), 'bad.yaml');
    writeFileSync(path, 'name: bad\nworld: ../nowhere.yaml\nsenses: { sound: { bands: 0 } }\nlearners: [{ name: a, objective: untrained, input: [sight] }]\n');
    const printed = await rejections(['--config', path]);
    expect(printed).toEqual(checkConfigFile(path).map((problem) => `crosswise explore: ${problem}`));
    expect(printed.some((line) => line.startsWith(`crosswise explore: ${path}:3:`) && line.includes('senses.sound.bands'))).toBe(true);
  });

  it('refuses a replay of a folder that is no recording, of a recording whose world changed, and beside a world', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-explore-'));
    const world = join(dir, 'greenhouse.yaml');
    writeFileSync(world, readFileSync('worlds/greenhouse.yaml'));
    const folder = join(dir, 'walk');
    vi.spyOn(console, 'log').mockImplementation(() => undefined);
    expect(await recordCommand([world, '--steps', '20', '--out', folder])).toBe(0);
    const manifest = join(folder, 'manifest.json');
    const printed = await rejections(['--replay', dir], ['--config', world, '--replay', folder]);
    writeFileSync(world, `${readFileSync(world, 'utf8')}\n# edited after recording\n`);
    printed.push(...await rejections(['--replay', folder]));
    writeFileSync(manifest, readFileSync(manifest, 'utf8').replace('"format_version": 1', '"format_version": 99'));
    printed.push(...await rejections(['--replay', folder]));
    expect(printed).toEqual([
      `crosswise explore: --replay: ${dir}: not a recording (no manifest.json; crosswise record writes one)`,
      "crosswise explore: --replay shows the recording's own world and senses: drop --config",
      `crosswise explore: --replay: the world file ${world} has changed since it was recorded (its sha256 differs from the manifest's)`,
      `crosswise explore: --replay: ${manifest}: format_version: expected 1, got 99 (written by another version of crosswise; record again)`,
    ]);
  });
});
