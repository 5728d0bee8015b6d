import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { commitCellFolder, isFinished, moveCellAside, removeLeftovers } from '../../src/results/cell-folder.js';
import { scratchFolders } from '../scratch.js';

describe('cell folders', () => {
  const output = scratchFolders('crosswise-cells-');

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

  it('replaces a stored copy when told to (a failed cell being retried), leaving no temporary folder', () => {
    const out = output();
    commitCellFolder(out, '0123456789', { 'cell.json': 'failed\n', 'train.csv': 'x\n' });
    commitCellFolder(out, '0123456789', { 'cell.json': 'done\n' }, () => true);
    expect(readdirSync(join(out, 'cells'))).toEqual(['0123456789']);
    expect(readdirSync(join(out, 'cells', '0123456789'))).toEqual(['cell.json']);
    expect(readFileSync(join(out, 'cells', '0123456789', 'cell.json'), 'utf8')).toBe('done\n');
  });

  it('moves a damaged folder aside under the first free .damaged-<id>-<n>, keeping its files', () => {
    const out = output();
    mkdirSync(join(out, 'cells', '.damaged-0123456789-1'), { recursive: true });
    commitCellFolder(out, '0123456789', { 'scores.csv': 'a\n' });
    expect(moveCellAside(out, '0123456789')).toBe('.damaged-0123456789-2');
    expect(readFileSync(join(out, 'cells', '.damaged-0123456789-2', 'scores.csv'), 'utf8')).toBe('a\n');
    expect(existsSync(join(out, 'cells', '0123456789'))).toBe(false);
  });

  it('removes temporary files and folders of dead processes on this machine only', () => {
    const out = output();
    const dead = spawnSync(process.execPath, ['-e', '0']).pid as number;
    const cells = [
      `.partial-${hostname()}-${dead}-aaaa`,          // a killed run here: removed
      `.partial-${hostname()}-${process.pid}-bbbb`,   // a task still writing: kept
      `.partial-elsewhere.example-${dead}-cccc`,      // another machine's task: kept
      '0123456789',                                   // a finished cell: kept
    ];
    for (const name of cells) mkdirSync(join(out, 'cells', name), { recursive: true });
    const files = [`results.csv.partial-${hostname()}-${dead}-dddd`, `results.csv.partial-${hostname()}-${process.pid}-eeee`, 'results.csv'];
    for (const name of files) writeFileSync(join(out, name), 'x');
    mkdirSync(join(out, 'plots'));
    writeFileSync(join(out, 'plots', `training.svg.partial-${hostname()}-${dead}-ffff`), 'x');
    removeLeftovers(out);
    expect(readdirSync(join(out, 'cells')).sort()).toEqual(cells.slice(1).sort());
    expect(readdirSync(out).filter((name) => name.startsWith('results')).sort()).toEqual(files.slice(1).sort());
    expect(readdirSync(join(out, 'plots'))).toEqual([]);
  });
});
