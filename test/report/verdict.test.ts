import { describe, expect, it } from 'vitest';
import type { Comparison } from '../../src/report/comparisons.js';
import type { ScoreGroup } from '../../src/report/groups.js';
import type { MeasureRow } from '../../src/results/results-table.js';
import { verdictLines, type VerdictInput } from '../../src/report/verdict.js';

// Test data: hand-made comparison records and measure rows (only the fields the sentence reads matter).
function comparison(learner: string, meanDiff: number, pHolm: number, fields: Partial<Comparison> = {}): Comparison {
  return { learner, severity: null, meanDiff, pHolm, n: 9, ciLow: meanDiff - 0.05, ciHigh: meanDiff + 0.05, p: pHolm, t: NaN, dz: NaN,
    sdDiff: 0.04, note: '', combination: 1, vary: {}, baseline: 'base', target: 'x', channel: 'sight', kind: 'gaussian',
    measure: 'noisy', family: 'primary', metric: 'r2', ...fields };
}

// Corrected clean score = noisy + drop per seed: a 0.6, 0.7 and base 0.5, 0.6 → clean difference +0.1 in both seeds.
function measures(): MeasureRow[] {
  const row = (learner: string, seed: number, measure: MeasureRow['measure'], value: number): MeasureRow => ({
    cell: learner, learner, objective: 'predict', rule: 'backprop', seed, target: 'x', channel: 'sight', kind: 'gaussian',
    severity: null, parameter: null, measure, metric: 'r2', value, vary: {} });
  return [row('a', 1, 'noisy', 0.4), row('a', 1, 'drop', 0.2), row('a', 2, 'noisy', 0.5), row('a', 2, 'drop', 0.2),
    row('base', 1, 'noisy', 0.3), row('base', 1, 'drop', 0.2), row('base', 2, 'noisy', 0.35), row('base', 2, 'drop', 0.25)];
}
const group: ScoreGroup = { target: 'x', metric: 'r2', channel: 'sight', kind: 'gaussian', rows: [], measures: measures() };
const input = (comparisons: Comparison[], learners = ['a']): VerdictInput =>
  ({ group, baseline: 'base', primary: 'noisy', comparisons, learners, familySize: 6 });

const verdict = (x: VerdictInput): string => verdictLines(x).join('\n');

describe('verdictLines', () => {
  it('names a reliable difference in the primary measure with its CI beside the clean difference', () => {
    // Reliable: Holm p 0.01 < 0.05 and the CI [+0.070, +0.170] excludes 0 (the rule in src/report/comparisons.ts).
    expect(verdict(input([comparison('a', 0.12, 0.01)]))).toBe('- x under sight gaussian noise (noisy, learner − base, chance-corrected): '
      + 'in these runs, a kept reliably more of the world under noise than base: +0.120 [+0.070, +0.170], Holm p 0.010, 9 seeds; '
      + 'clean +0.100 [+0.100, +0.100].');
  });

  it('says what the seeds could have detected, and that a miss is not equality, when a difference is not reliable', () => {
    // d_z detectable by 9 seeds at α = 0.05/6 with 80% power: 1.49 (src/stats/power.ts, checked against SciPy there);
    // in the measure's units 1.49 × the spread of differences 0.04 ≈ 0.060.
    expect(verdict(input([comparison('a', -0.02, 0.6)]))).toContain('a did not differ reliably from base: -0.020 [-0.070, +0.030], '
      + 'Holm p 0.600, 9 seeds; clean +0.100 [+0.100, +0.100]; these seeds detect d_z ≥ 1.49 (about 0.060 at this spread) with 80% power, '
      + 'so a smaller difference may have been missed: not evidence that the two are equally robust.');
  });

  it('does not test an identical comparison', () => {
    const identical = comparison('a', 0, NaN, { family: 'identical', note: 'differences have zero variance', ciLow: 0, ciHigh: 0 });
    expect(verdict(input([identical]))).toContain('a − base was +0.000 in every seed (identical features, or noise that changes neither): nothing to test.');
  });

  it('says that both kept nothing when both are at 0 on the corrected scale in every seed', () => {
    const zero = { ...group, measures: group.measures.map((r) => ({ ...r, value: r.measure === 'noisy' ? 0 : r.value })) };
    const identical = comparison('a', 0, NaN, { family: 'identical', note: 'differences have zero variance', ciLow: 0, ciHigh: 0 });
    expect(verdict({ ...input([identical]), group: zero })).toContain('both a and base kept nothing of it under this noise (corrected noisy 0 in every seed): nothing to compare.');
  });

  it('says so when the primary family has no learner', () => {
    expect(verdict(input([], []))).toBe('- x under sight gaussian noise: no learner other than the baseline and the controls, so there is no primary comparison.');
  });

  it('gives each learner a line of its own under the target and noise when the family has several', () => {
    // b has no measure rows of its own, so its clean difference pairs no seeds (n/a); only the layout matters here.
    const lines = verdictLines(input([comparison('a', 0.12, 0.01), comparison('b', -0.02, 0.6, { learner: 'b' })], ['a', 'b']));
    expect(lines).toHaveLength(3);
    expect(lines[0]).toBe('- x under sight gaussian noise (noisy, learner − base, chance-corrected), in these runs:');
    expect(lines[1]).toMatch(/^ {2}- a kept reliably more of the world under noise than base: \+0\.120 /);
    expect(lines[2]).toMatch(/^ {2}- b did not differ reliably from base: -0\.020 .*equally robust\.$/);
  });
});
