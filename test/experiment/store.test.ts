import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { removePartialCells, trainCsv } from '../../src/experiment/store.js';

describe('results store', () => {
  it('removes temporary cell folders of dead processes on this machine only', () => {
    const out = mkdtempSync(join(tmpdir(), 'crosswise-store-'));
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

  it('writes one train.csv line per epoch with an alignment column per layer', () => {
    const text = trainCsv([
      { epoch: 1, trainLoss: 0.5, validationLoss: 0.625, seconds: 1.5, alignmentDeg: [80, 0] },
      { epoch: 2, trainLoss: 0.25, validationLoss: 0.5, seconds: 1.25, alignmentDeg: [70, 0] },
    ]);
    expect(text).toBe('epoch,train_loss,validation_loss,seconds,alignment_deg_1,alignment_deg_2\n1,0.5,0.625,1.5,80,0\n2,0.25,0.5,1.25,70,0\n');
  });
});
