import { readFileSync, truncateSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { RESULTS_FORMAT_VERSION } from '../../src/results/format-version.js';
import { inspectStoredCell } from '../../src/results/stored-cell.js';
import { injectFault } from '../faults/fs-faults.js';
import { testCellId, writeRun, type TestCell } from '../report/stored-cells.js';
import { scratchFolders } from '../scratch.js';

// Test data: one stored done cell with made-up scores.
const CELL: TestCell = {
  learner: 'sight-autoencoder', objective: 'reconstruct', rule: 'backprop', seed: 1,
  rows: [{ target: 'x', channel: 'sight', kind: 'gaussian', severity: 0, parameter: 0, measure: 'score', metric: 'r2', value: 0.5 }],
  log: [{ epoch: 1, trainLoss: 1, validationLoss: 1.5, seconds: 0.1, alignmentDeg: [] }],
};
const ID = testCellId(CELL);

describe('inspectStoredCell: a stored cell is trusted only when every file it lists verifies', () => {
  const folder = scratchFolders('crosswise-inspect-');
  const stored = () => {
    const out = folder();
    writeRun(out, [CELL], { name: 'inspect' });
    return { out, file: (name: string) => join(out, 'cells', ID, name) };
  };

  it('trusts a cell as committed, and records each file with its size and SHA-256', () => {
    const { out, file } = stored();
    const state = inspectStoredCell(out, ID);
    expect(state.state).toBe('trusted');
    const scores = readFileSync(file('scores.csv'));
    expect(state.state === 'trusted' && state.record.files['scores.csv'].bytes).toBe(scores.byteLength);
    expect(Object.keys(state.state === 'trusted' ? state.record.files : {}).sort()).toEqual(['scores.csv', 'train.csv']);
  });

  it('calls a cell that was never stored absent', () => {
    const { out } = stored();
    expect(inspectStoredCell(out, 'ffffffffff')).toEqual({ state: 'absent' });
  });

  // Each case injects one fault into a stored cell and names the fault the inspection must report.
  const faults: [string, (file: (name: string) => string) => void, { file: string; fault: RegExp }][] = [
    ['a truncated scores.csv', (f) => truncateSync(f('scores.csv'), 20), { file: 'scores.csv', fault: /^truncated \(20 of \d+ bytes\)$/ }],
    ['an emptied scores.csv', (f) => truncateSync(f('scores.csv'), 0), { file: 'scores.csv', fault: /^empty$/ }],
    ['a deleted scores.csv', (f) => unlinkSync(f('scores.csv')), { file: 'scores.csv', fault: /^missing$/ }],
    ['a scores.csv of the same size with other bytes', (f) => {
      const text = readFileSync(f('scores.csv'), 'utf8');
      writeFileSync(f('scores.csv'), text.replace('0.5', '0.9'));
    }, { file: 'scores.csv', fault: /^changed since it was stored \(SHA-256 differs\)$/ }],
    ['rows appended to scores.csv', (f) => writeFileSync(f('scores.csv'), 'garbage\n', { flag: 'a' }), { file: 'scores.csv', fault: /^longer than stored/ }],
    ['a truncated cell.json', (f) => truncateSync(f('cell.json'), 100), { file: 'cell.json', fault: /^not valid JSON/ }],
    ['an emptied cell.json', (f) => truncateSync(f('cell.json'), 0), { file: 'cell.json', fault: /^empty$/ }],
    ['a deleted cell.json', (f) => unlinkSync(f('cell.json')), { file: 'cell.json', fault: /^missing$/ }],
    ['a cell.json of another format version', (f) => {
      writeFileSync(f('cell.json'), readFileSync(f('cell.json'), 'utf8').replace(`"format_version": ${RESULTS_FORMAT_VERSION}`, '"format_version": 1'));
    }, { file: 'cell.json', fault: new RegExp(`^format_version: expected ${RESULTS_FORMAT_VERSION}, got 1`) }],
  ];
  for (const [what, inject, expected] of faults) {
    it(`reports ${what} as damaged, naming the file`, () => {
      const { out, file } = stored();
      inject(file);
      const state = inspectStoredCell(out, ID);
      expect(state.state).toBe('damaged');
      if (state.state !== 'damaged') return;
      expect(state.fault.file).toBe(expected.file);
      expect(state.fault.fault).toMatch(expected.fault);
    });
  }

  it('reports a cell folder it cannot read (EACCES injected on reading the folder) as damaged', () => {
    const { out } = stored();
    const restore = injectFault('readdirSync', 'EACCES', (path) => path.endsWith(ID));
    try {
      expect(inspectStoredCell(out, ID)).toEqual({ state: 'damaged', fault: { file: '(folder)', fault: 'unreadable (EACCES)' } });
    } finally {
      restore();
    }
  });
});
