import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { commitCellFolder, isFinished, removePartialCells } from '../../src/results/cell-folder.js';

describe('cell folders', () => {
  const dirs: string[] = [];
  afterEach(() => { for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true }); });
  const output = () => {
    const out = mkdtempSync(join(tmpdir(), 'crosswise-cells-'));
    dirs.push(out);
    return out;
  };

  it('commits every file of a cell at once and leaves no temporary folder', () => {
    const out = output();
    commitCellFolder(out, '0123456789', { 'cell.json': '{}\n', 'scores.csv': 'a\n' });
    expect(isFinished(out, '0123456789')).toBe(true);
    expect(readdirSync(join(out, 'cells'))).toEqual(['0123456789']);
    expect(readFileSync(join(out, 'cells', '0123456789', 'scores.csv'), 'utf8')).toBe('a\n');
  });

  it('keeps the first copy when another process already stored the same cell', () => {
    const out = output();
    commitCellFolder(out, '0123456789', { 'cell.json': 'first\n' });
    commitCellFolder(out, '0123456789', { 'cell.json': 'second\n' });
    expect(readFileSync(join(out, 'cells', '0123456789', 'cell.json'), 'utf8')).toBe('first\n');
    expect(readdirSync(join(out, 'cells'))).toEqual(['0123456789']);
  });

  it('removes temporary cell folders of dead processes on this machine only', () => {
    const out = output();
    const dead = spawnSync(process.execPath, ['-e', '0']).pid as number;
    const names = [
      `.partial-${hostname()}-${dead}-aaaa`,          // a killed run here: removed
      `.partial-${hostname()}-${process.pid}-bbbb`,   // a task still writing: kept
      `.partial-elsewhere.example-${dead}-cccc`,      // another machine's task: kept
      '0123456789',                                   // a finished cell: kept
    ];
    for (const name of names) mkdirSync(join(out, 'cells', name), { recursive: true });
    removePartialCells(out);
    expect(readdirSync(join(out, 'cells')).sort()).toEqual(names.slice(1).sort());
    expect(existsSync(join(out, 'cells', names[0]))).toBe(false);
  });
});
