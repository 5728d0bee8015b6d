import { describe, expect, it } from 'vitest';
import { compareWithBaseline, holmFamilySize } from '../../src/report/comparisons.js';
import type { ScoreRow } from '../../src/results/results-table.js';

// σ of the gaussian row of the severity table (src/noise/severity.ts), by severity.
const GAUSSIAN_SIGMA = [0, 0.25, 0.5, 1, 2, 4];

// Test data: learners a (baseline) and b, three seeds, one target, two noises that share
// the clean (severity 0) score and differ at severity 1.
function row(learner: string, seed: number, channel: string, severity: number, value: number): ScoreRow {
  return { cell: `${learner}${seed}`, learner, objective: 'predict', rule: 'backprop', seed, target: 'x', channel,
    kind: 'gaussian', severity, parameter: GAUSSIAN_SIGMA[severity], measure: 'score', metric: 'r2', value, vary: {} };
}
const rows: ScoreRow[] = [];
for (const seed of [1, 2, 3]) {
  for (const channel of ['sight', 'sound']) {
    rows.push(row('a', seed, channel, 0, 0.5 + 0.1 * seed), row('b', seed, channel, 0, 0.55 + 0.1 * seed + 0.01 * seed));
    rows.push(row('a', seed, channel, 1, 0.3), row('b', seed, channel, 1, channel === 'sight' ? 0.3 + 0.1 * seed : 0.3 + 0.05 * seed * seed));
  }
}

describe('compareWithBaseline', () => {
  const student2 = (t: number): number => 1 - Math.abs(t) / Math.sqrt(t * t + 2); // two-sided p, 2 df (closed form)

  it('pairs by seed and computes b − a per severity', () => {
    const sight1 = compareWithBaseline(rows, [], 'a').find((c) => c.channel === 'sight' && c.severity === 1)!;
    // Differences 0.1, 0.2, 0.3 → mean 0.2, sd 0.1, t = 0.2 / (0.1 / √3) = 3.4641 (by hand).
    expect(sight1.meanDiff).toBeCloseTo(0.2, 12);
    expect(sight1.t).toBeCloseTo(2 * Math.sqrt(3), 10);
    expect(sight1.p).toBeCloseTo(student2(2 * Math.sqrt(3)), 10);
  });

  it('counts the clean comparison shared by two noises once in Holm (Holm 1979)', () => {
    const all = compareWithBaseline(rows, [], 'a');
    expect(all.length).toBe(4);
    const clean = all.filter((c) => c.severity === 0);
    expect(clean[0].pHolm).toBe(clean[1].pHolm);
    // Three distinct hypotheses: clean, sight at 1, sound at 1. Holm's largest adjusted value
    // is max over the running maximum, and the smallest raw p gets the factor m = 3.
    const distinct = [clean[0].p, all.find((c) => c.channel === 'sight' && c.severity === 1)!.p,
      all.find((c) => c.channel === 'sound' && c.severity === 1)!.p];
    const smallest = Math.min(...distinct);
    expect(Math.min(...all.map((c) => c.pHolm))).toBeCloseTo(3 * smallest, 12);
    expect(holmFamilySize(all)).toBe(3);
  });

  it('leaves out learners without a seed in common with the baseline', () => {
    const only = [row('a', 1, 'sight', 0, 0.5), row('b', 2, 'sight', 0, 0.6)];
    expect(compareWithBaseline(only, [], 'a')).toEqual([]);
  });
});
