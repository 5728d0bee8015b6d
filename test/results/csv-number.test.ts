import { describe, expect, it } from 'vitest';
import { formatCsvNumber, parseCsvNumber } from '../../src/results/csv-number.js';

describe('numbers in CSV files', () => {
  it('writes the shortest text that reads back as the same double (ECMAScript Number::toString)', () => {
    expect(formatCsvNumber(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(formatCsvNumber(1e-7)).toBe('1e-7');
    expect(parseCsvNumber(formatCsvNumber(0.1 + 0.2))).toBe(0.1 + 0.2);
  });

  it('spells the infinities inf and -inf and an undefined number as an empty field, the way pandas reads them', () => {
    expect([Infinity, -Infinity, NaN].map(formatCsvNumber)).toEqual(['inf', '-inf', '']);
    expect(parseCsvNumber('inf')).toBe(Infinity);
    expect(parseCsvNumber('-inf')).toBe(-Infinity);
    expect(parseCsvNumber('')).toBeNaN();
  });

  it('rejects other text, including NaN and padded numbers', () => {
    expect(['NaN', 'Infinity', 'one', ' 1'].map(parseCsvNumber)).toEqual([null, null, null, null]);
  });
});
