import { describe, expect, it } from 'vitest';
import type { Comparison } from '../../src/report/comparisons.js';
import { verdict } from '../../src/report/sections.js';

// Test data: hand-made comparison records (only the fields the sentence reads matter).
function comparison(learner: string, severity: number, meanDiff: number, pHolm: number, n: number): Comparison {
  const half = 0.05;
  return { learner, severity, meanDiff, pHolm, n, ciLow: meanDiff - half, ciHigh: meanDiff + half, p: pHolm, t: NaN, dz: NaN,
    sdDiff: NaN, note: '', combination: 1, vary: {}, baseline: 'base', target: 'x', channel: 'sight', kind: 'gaussian', measure: 'score', family: 'primary', metric: 'r2' };
}
const noise = { channel: 'sight', kind: 'gaussian' };

describe('verdict', () => {
  it('lists severities in plain English and judges only noisy severities', () => {
    const line = verdict('x', noise, 'base', [
      comparison('a', 0, 0.3, 0.001, 12), comparison('a', 1, 0.2, 0.01, 12), comparison('a', 2, 0.2, 0.02, 12),
      comparison('a', 3, 0.01, 0.6, 12), comparison('b', 1, 0.02, 0.04, 12),
    ]);
    // b's CI [−0.03, 0.07] includes 0, so p < 0.05 alone does not make it reliable.
    expect(line).toBe('In these runs (12 seeds), for x under sight gaussian noise, counting a difference as reliable when its '
      + 'Holm-adjusted p < 0.05 and its 95% CI excludes 0: a scored reliably higher than base at severities 1 and 2; '
      + 'b was not distinguishable from base.');
  });

  it('adds the low-power caution below 10 seeds (common practice)', () => {
    expect(verdict('x', noise, 'base', [comparison('a', 1, 0, 1, 3)])).toContain(
      'With 3 seeds the paired tests have little power, so "not distinguishable" is not evidence of equal robustness.');
  });

  it('says so when nothing could be paired', () => {
    expect(verdict('x', noise, 'base', [])).toBe('In these runs, no learner could be paired with base by seed for x under sight gaussian noise.');
  });
});
