import { describe, expect, it } from 'vitest';
import { checkNoiseSpec, noiseSpecProblem } from '../../src/noise/corrupt.js';
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
  it('uses explicit parameters in place of the table, but severity 0 stays clean', () => {
    const spec = { channel: 'sight', kind: 'gaussian', severities: [0, 1, 7], parameters: [3, 0.1, 9] } as const;
    expect([0, 1, 2].map((i) => noiseParameter(spec, i))).toEqual([0, 0.1, 9]);
  });
});

describe('checkNoiseSpec', () => {
  it('accepts a tabled sweep', () => {
    expect(noiseSpecProblem({ channel: 'sound', kind: 'masking', severities: [0, 1, 2, 3, 4, 5] })).toBeNull();
  });

  it('names the spec and the reason for masking on sight', () => {
    expect(() => checkNoiseSpec({ channel: 'sight', kind: 'masking', severities: [1] }))
      .toThrow("noise sight/masking: kind 'masking' cannot corrupt channel 'sight'; it accepts sound");
  });

  it('asks for explicit parameters beyond severity 5', () => {
    expect(noiseSpecProblem({ channel: 'sight', kind: 'gaussian', severities: [0, 6] }))
      .toBe('severity 6 has no tabled parameter (0..5); give explicit parameters');
  });

  it('rejects a parameter list of the wrong length and an out-of-range parameter', () => {
    expect(noiseSpecProblem({ channel: 'touch', kind: 'dropout', severities: [1, 2], parameters: [0.5] }))
      .toBe('parameters must have one value per severity (2), got 1');
    expect(noiseSpecProblem({ channel: 'touch', kind: 'dropout', severities: [1, 2], parameters: [0.5, 2] }))
      .toBe('parameter 2 at severity 2 must be a fraction p in [0, 1]');
  });

  it('rejects repeated and negative severities', () => {
    expect(noiseSpecProblem({ channel: 'touch', kind: 'blackout', severities: [1, 1] })).toBe('severities must not repeat, got [1, 1]');
    expect(noiseSpecProblem({ channel: 'touch', kind: 'blackout', severities: [-1] })).toBe('severities must be integers ≥ 0, got -1');
  });
});
