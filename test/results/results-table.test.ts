import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../src/results/csv.js';
import { formatResultsCsv, parseResultsCsv, type ResultRow } from '../../src/results/results-table.js';

// Test data: two invented rows.
const rows: ResultRow[] = [
  { cell: 'a1b2', learner: 'sound-from-sight', objective: 'predict', rule: 'backprop', seed: 1, target: 'x',
    channel: 'sight', kind: 'gaussian', severity: 2, metric: 'r2', value: 0.8125, vary: { 'learners.*.encoder.hidden': '[64, 32]' } },
  { cell: 'c3d4', learner: 'odd "name"', objective: 'untrained', rule: 'backprop', seed: 2, target: '-',
    channel: 'sight', kind: 'gaussian', severity: 0, metric: 'cka', value: NaN, vary: { 'learners.*.encoder.hidden': '[64]' } },
];

describe('formatResultsCsv', () => {
  it('quotes fields holding commas or quotes as RFC 4180 section 2 requires', () => {
    const text = formatResultsCsv(rows, ['learners.*.encoder.hidden']);
    const lines = text.split('\n');
    expect(lines[0]).toBe('cell,learner,objective,rule,seed,target,channel,kind,severity,metric,value,learners.*.encoder.hidden');
    expect(lines[1]).toBe('a1b2,sound-from-sight,predict,backprop,1,x,sight,gaussian,2,r2,0.8125,"[64, 32]"');
    expect(lines[2]).toBe('c3d4,"odd ""name""",untrained,backprop,2,-,sight,gaussian,0,cka,NaN,[64]');
  });
});

describe('parseResultsCsv', () => {
  it('reads back what formatResultsCsv wrote', () => {
    const table = parseResultsCsv(formatResultsCsv(rows, ['learners.*.encoder.hidden']));
    expect(table.varyKeys).toEqual(['learners.*.encoder.hidden']);
    expect(table.rows[0]).toEqual(rows[0]);
    expect(table.rows[1].learner).toBe('odd "name"');
    expect(table.rows[1].value).toBeNaN();
  });

  it('accepts CRLF line ends and a quoted line break (RFC 4180)', () => {
    expect(parseCsv('a,"b\r\nc"\r\nd,e\r\n', 't.csv').map((r) => [r.line, r.fields])).toEqual([
      [1, ['a', 'b\r\nc']], [3, ['d', 'e']],
    ]);
  });

  it('names file, line and column for a bad value', () => {
    const text = formatResultsCsv(rows, []).replace('0.8125', 'oops');
    expect(() => parseResultsCsv(text, 'runs/x/results.csv')).toThrow("runs/x/results.csv:2: value: expected a number, got 'oops'");
  });

  it('names the first wrong header column and rejects an unknown metric', () => {
    expect(() => parseResultsCsv('cell,learner,objective\n', 'r.csv')).toThrow("r.csv:1: column 4: expected 'rule', got ''");
    const text = formatResultsCsv(rows, []).replace(',r2,', ',mse,');
    expect(() => parseResultsCsv(text)).toThrow("results.csv:2: metric: expected one of r2, accuracy, chance, cka, got 'mse'");
  });

  it('rejects a row with the wrong number of fields', () => {
    const text = formatResultsCsv(rows, []) + 'x,y\n';
    expect(() => parseResultsCsv(text)).toThrow('results.csv:4: expected 11 fields, got 2');
  });
});
