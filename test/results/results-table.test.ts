import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/results/csv.js';
import { formatResultsCsv, parseResultsCsv, type ResultRow } from '../../src/results/results-table.js';

const HIDDEN = 'learners.*.encoder.hidden';

// Test data: invented rows. The parameters are those of the severity table
// (src/noise/severity.ts): gaussian σ 0.5 at severity 2, masking's clean SNR +∞ at severity 0.
const rows: ResultRow[] = [
  { cell: 'a1b2', learner: 'sound-from-sight', objective: 'predict', rule: 'backprop', seed: 1, target: 'x',
    channel: 'sight', kind: 'gaussian', severity: 2, parameter: 0.5, measure: 'score', metric: 'r2', value: 0.8125, vary: { [HIDDEN]: '[64, 32]' } },
  { cell: 'c3d4', learner: 'odd "name"', objective: 'untrained', rule: 'backprop', seed: 2, target: '-',
    channel: 'sound', kind: 'masking', severity: 0, parameter: Infinity, measure: 'score', metric: 'cka', value: NaN, vary: { [HIDDEN]: '[64]' } },
  { cell: 'c3d4', learner: 'odd "name"', objective: 'untrained', rule: 'backprop', seed: 2, target: 'x',
    channel: 'sound', kind: 'masking', severity: null, parameter: null, measure: 'drop', metric: 'r2', value: 0.25, vary: { [HIDDEN]: '[64]' } },
];

describe('formatResultsCsv', () => {
  it('writes the columns of the output layout, quoting fields as RFC 4180 section 2 requires', () => {
    const lines = formatResultsCsv(rows, [HIDDEN]).split('\n');
    expect(lines[0]).toBe('cell,learner,objective,rule,seed,target,channel,kind,severity,parameter,measure,metric,value,learners.*.encoder.hidden');
    expect(lines[1]).toBe('a1b2,sound-from-sight,predict,backprop,1,x,sight,gaussian,2,0.5,score,r2,0.8125,"[64, 32]"');
  });

  it('writes an undefined value as an empty field and an infinite parameter as inf, never NaN or Infinity', () => {
    expect(formatResultsCsv(rows, [HIDDEN]).split('\n')[2]).toBe('c3d4,"odd ""name""",untrained,backprop,2,-,sound,masking,0,inf,score,cka,,[64]');
  });

  it('leaves severity and parameter empty for a per-seed measure', () => {
    expect(formatResultsCsv(rows, [HIDDEN]).split('\n')[3]).toBe('c3d4,"odd ""name""",untrained,backprop,2,x,sound,masking,,,drop,r2,0.25,[64]');
  });
});

describe('parseResultsCsv', () => {
  it('reads back exactly what formatResultsCsv wrote, empty fields and infinities included', () => {
    const table = parseResultsCsv(formatResultsCsv(rows, [HIDDEN]));
    expect(table.varyKeys).toEqual([HIDDEN]);
    expect(table.rows).toEqual(rows);
  });

  it('accepts CRLF line ends and a quoted line break (RFC 4180)', () => {
    expect(parseCsv('a,"b\r\nc"\r\nd,e\r\n', 't.csv').map((r) => [r.line, r.fields])).toEqual([
      [1, ['a', 'b\r\nc']], [3, ['d', 'e']],
    ]);
  });

  it('names file, line and column for a bad value', () => {
    const text = formatResultsCsv(rows, []).replace('0.8125', 'oops');
    expect(() => parseResultsCsv(text, 'runs/x/results.csv')).toThrow("runs/x/results.csv:2: value: expected a number, inf, -inf or an empty field, got 'oops'");
  });

  it('rejects the text NaN, which crosswise never writes', () => {
    const text = formatResultsCsv(rows, []).replace('0.8125', 'NaN');
    expect(() => parseResultsCsv(text, 'r.csv')).toThrow("r.csv:2: value: expected a number, inf, -inf or an empty field, got 'NaN'");
  });

  it('requires a severity and a parameter for a score', () => {
    const text = formatResultsCsv(rows, []).replace(',2,0.5,score,', ',,0.5,score,');
    expect(() => parseResultsCsv(text, 'r.csv')).toThrow("r.csv:2: severity: expected a number for measure 'score', got ''");
  });

  it('requires an empty severity and parameter for a per-seed measure', () => {
    const text = formatResultsCsv(rows, []).replace(',,,drop,', ',,3,drop,');
    expect(() => parseResultsCsv(text, 'r.csv')).toThrow("r.csv:4: parameter: expected an empty field for measure 'drop', got '3'");
  });

  it('names the first wrong header column and rejects an unknown measure or metric', () => {
    expect(() => parseResultsCsv('cell,learner,objective\n', 'r.csv')).toThrow("r.csv:1: column 4: expected 'rule', got ''");
    expect(() => parseResultsCsv(formatResultsCsv(rows, []).replace(',r2,', ',mse,'))).toThrow("results.csv:2: metric: expected one of r2, accuracy, chance, cka, got 'mse'");
    expect(() => parseResultsCsv(formatResultsCsv(rows, []).replace(',score,', ',best,'))).toThrow("results.csv:2: measure: expected one of score, noisy, drop, area, got 'best'");
  });

  it('rejects a row with the wrong number of fields', () => {
    const text = formatResultsCsv(rows, []) + 'x,y\n';
    expect(() => parseResultsCsv(text)).toThrow('results.csv:5: expected 13 fields, got 2');
  });
});
