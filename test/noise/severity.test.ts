import { describe, expect, it } from 'vitest';
import { noiseParameter, severityParameter } from '../../src/noise/severity.js';

// The table is common practice (see SEVERITY_TABLE); these checks pin it so a change is deliberate.
describe('severityParameter', () => {
  it('maps severities 1..5 of each kind to the documented table', () => {
    expect([1, 2, 3, 4, 5].map((s) => severityParameter('gaussian', s))).toEqual([0.25, 0.5, 1, 2, 4]);
    expect([1, 2, 3, 4, 5].map((s) => severityParameter('dropout', s))).toEqual([0.1, 0.3, 0.5, 0.7, 0.9]);
    expect([1, 2, 3, 4, 5].map((s) => severityParameter('blackout', s))).toEqual([0.1, 0.3, 0.5, 0.7, 0.9]);
    expect([1, 2, 3, 4, 5].map((s) => severityParameter('masking', s))).toEqual([20, 10, 5, 0, -5]);
  });

  it('maps severity 0 to the clean parameter of each kind', () => {
    expect(severityParameter('gaussian', 0)).toBe(0);
    expect(severityParameter('dropout', 0)).toBe(0);
    expect(severityParameter('masking', 0)).toBe(Infinity);
  });

  it('rejects a severity beyond the table', () => {
    expect(() => severityParameter('gaussian', 6)).toThrow('noise severity must be an integer from 0 to 5 (or give explicit parameters), got 6');
  });
});

describe('noiseParameter', () => {
  it('uses explicit parameters in place of the table', () => {
    const spec = { channel: 'sight', kind: 'gaussian', severities: [0, 1, 7], parameters: [0, 0.1, 9] } as const;
    expect([0, 1, 2].map((i) => noiseParameter(spec, i))).toEqual([0, 0.1, 9]);
  });

  it('uses the table, severity 0 clean, when no parameters are given', () => {
    const spec = { channel: 'sound', kind: 'masking', severities: [0, 2] } as const;
    expect([0, 1].map((i) => noiseParameter(spec, i))).toEqual([Infinity, 10]);
  });
});
