import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { checkCommand } from '../../src/commands/check.js';

let dir: string;
let out: string[];
let err: string[];

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'crosswise-check-'));
  out = [];
  err = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => { out.push(line); });
  vi.spyOn(console, 'error').mockImplementation((line: string) => { err.push(line); });
});

afterEach(() => vi.restoreAllMocks());

describe('crosswise check', () => {
  it('accepts every shipped demo world', async () => {
    const worlds = ['worlds/greenhouse.yaml', 'worlds/workshop.yaml', 'worlds/cave.yaml'];
    expect(await checkCommand(worlds)).toBe(0);
    expect(out).toEqual(worlds.map((w) => `${w}: ok (world)`));
  });

  it('prints one line per problem, crosswise check: path:line:col: reason, and exits 1', async () => {
    const path = join(dir, 'bad.yaml');
    writeFileSync(path, 'name: x\ncell_size_m: 0\nmaterials: []\nemitters: []\nmap: |\n  #\n');
    expect(await checkCommand([path])).toBe(1);
    expect(err[0]).toBe(`crosswise check: ${path}:2:14: cell_size_m: expected a number > 0 and <= 100, got 0`);
    expect(err.every((line) => line.startsWith(`crosswise check: ${path}:`))).toBe(true);
  });

  it('says a file is neither a world nor anything else it knows', async () => {
    const path = join(dir, 'other.yaml');
    writeFileSync(path, 'title: hello\n');
    expect(await checkCommand([path])).toBe(1);
    expect(err).toEqual([`crosswise check: ${path}:1:1: not a world or config file (a world has 'map', 'materials' and 'emitters'; a config has 'learners' and 'world')`]);
  });

  it('reports a missing file and no arguments as errors', async () => {
    expect(await checkCommand([join(dir, 'none.yaml')])).toBe(1);
    expect(err[0]).toBe(`crosswise check: ${join(dir, 'none.yaml')}:1:1: cannot read the file (ENOENT)`);
    expect(await checkCommand([])).toBe(1);
    expect(err[1]).toBe('crosswise check: missing <file> (usage: crosswise check <file>...)');
  });
});
