import { describe, expect, it } from 'vitest';
import { num, signed } from '../../src/report/markdown.js';

describe('numbers in summary.md', () => {
  it('write a value that rounds to zero without a minus sign (common practice: no "-0.000")', () => {
    expect(num(-0.00001)).toBe('0.000');
    expect(num(-0.00001, 2)).toBe('0.00');
    expect(signed(-0.00001)).toBe('+0.000');
  });

  it('keep the sign of values that do not round to zero, and n/a for undefined ones', () => {
    expect([signed(-0.3), signed(0.012), num(-0.0005), signed(NaN)]).toEqual(['-0.300', '+0.012', '-0.001', 'n/a']);
  });
});
