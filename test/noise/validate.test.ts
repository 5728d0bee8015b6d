import { describe, expect, it } from 'vitest';
import { checkNoiseEntries, noiseProblems } from '../../src/noise/validate.js';

// The rules are crosswise's own contract for a config's `noise` list (the severity table in
// src/noise/severity.ts, the parameter meanings in src/noise/kinds.ts).
describe('noiseProblems', () => {
  it('accepts tabled sweeps of every kind, and explicit parameters beyond severity 5', () => {
    expect(noiseProblems([
      { channel: 'sight', kind: 'gaussian', severities: [0, 1, 2, 3, 4, 5] },
      { channel: 'sound', kind: 'masking', severities: [0, 5] },
      { channel: 'touch', kind: 'dropout', severities: [0, 6, 9], parameters: [0, 0.95, 0.99] },
      { channel: 'sound', kind: 'blackout', severities: [1] },
    ])).toEqual([]);
  });

  it('accepts .inf, the clean SNR, for masking at severity 0', () => {
    expect(noiseProblems([{ channel: 'sound', kind: 'masking', severities: [0, 1], parameters: [Infinity, 12] }])).toEqual([]);
  });

  it('locates a parameter outside its kind range', () => {
    expect(noiseProblems([{ channel: 'sight', kind: 'dropout', severities: [0, 1], parameters: [0, 1.5] }])).toEqual([
      { path: ['noise', 0, 'parameters', 1], message: 'expected a fraction p in [0, 1], got 1.5' },
    ]);
  });

  it('rejects an explicit parameter at severity 0 other than the clean one', () => {
    expect(noiseProblems([
      { channel: 'sight', kind: 'gaussian', severities: [0, 1], parameters: [0.5, 1] },
      { channel: 'sound', kind: 'masking', severities: [1, 0], parameters: [10, 20] },
    ])).toEqual([
      { path: ['noise', 0, 'parameters', 0], message: 'severity 0 is the clean input, so its parameter must be 0, got 0.5' },
      { path: ['noise', 1, 'parameters', 1], message: 'severity 0 is the clean input, so its parameter must be .inf, got 20' },
    ]);
  });

  it('rejects a second entry with the same channel and kind, naming the first', () => {
    expect(noiseProblems([
      { channel: 'sight', kind: 'gaussian', severities: [1] },
      { channel: 'sight', kind: 'dropout', severities: [1] },
      { channel: 'sight', kind: 'gaussian', severities: [2] },
    ])).toEqual([
      { path: ['noise', 2], message: 'sight gaussian is already noise.0; entries with the same channel and kind would share result rows and noise draws' },
    ]);
  });

  it('rejects masking on a channel other than sound', () => {
    expect(noiseProblems([{ channel: 'touch', kind: 'masking', severities: [1] }])).toEqual([
      { path: ['noise', 0, 'channel'], message: "masking noise applies to sound only, got 'touch'" },
    ]);
  });

  it('rejects a parameter list whose length is not the number of severities', () => {
    expect(noiseProblems([{ channel: 'sight', kind: 'gaussian', severities: [0, 1], parameters: [0, 1, 2] }])).toEqual([
      { path: ['noise', 0, 'parameters'], message: 'expected one value per severity (2), got 3' },
    ]);
  });

  it('asks for explicit parameters beyond severity 5', () => {
    expect(noiseProblems([{ channel: 'sight', kind: 'gaussian', severities: [0, 6] }])).toEqual([
      { path: ['noise', 0, 'severities', 1], message: 'severity 6 has no row in the severity table (0..5); give explicit parameters' },
    ]);
  });

  it('rejects empty, repeated, negative and fractional severities', () => {
    expect(noiseProblems([
      { channel: 'touch', kind: 'blackout', severities: [] },
      { channel: 'sight', kind: 'blackout', severities: [1, 1, -1, 0.5] },
    ])).toEqual([
      { path: ['noise', 0, 'severities'], message: 'expected at least 1 severity, got an empty list' },
      { path: ['noise', 1, 'severities', 1], message: 'severity 1 is listed twice' },
      { path: ['noise', 1, 'severities', 2], message: 'expected a whole number ≥ 0, got -1' },
      { path: ['noise', 1, 'severities', 3], message: 'expected a whole number ≥ 0, got 0.5' },
    ]);
  });

  it('rejects unknown channel and kind names', () => {
    expect(noiseProblems([{ channel: 'smell', kind: 'gaussian', severities: [1] }, { channel: 'sight', kind: 'fog', severities: [1] }])).toEqual([
      { path: ['noise', 0, 'channel'], message: "expected one of sight | sound | touch | motor, got 'smell'" },
      { path: ['noise', 1, 'kind'], message: "expected one of gaussian | dropout | blackout | masking, got 'fog'" },
    ]);
  });

  it('rejects an infinite σ and an SNR of −∞', () => {
    expect(noiseProblems([
      { channel: 'sight', kind: 'gaussian', severities: [1], parameters: [Infinity] },
      { channel: 'sound', kind: 'masking', severities: [1], parameters: [-Infinity] },
    ]).map((p) => p.message)).toEqual([
      'expected a std multiple σ ≥ 0, got .inf',
      'expected an SNR in dB (a finite number, or .inf for clean), got -.inf',
    ]);
  });
});

describe('checkNoiseEntries', () => {
  it('throws every problem on one line, located', () => {
    expect(() => checkNoiseEntries([{ channel: 'sight', kind: 'dropout', severities: [0, 1], parameters: [0, 1.5] }]))
      .toThrow(/^noise\.0\.parameters\.1: expected a fraction p in \[0, 1\], got 1\.5$/);
  });
});
