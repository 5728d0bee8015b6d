import { describe, expect, it } from 'vitest';
import type { ScoreRow } from '../../src/results/results-table.js';
import { robustnessTable } from '../../src/report/sections.js';

// Test data: one seed per learner so each mean is the value itself.
function rows(scores: Readonly<Record<string, readonly number[]>>): ScoreRow[] {
  return Object.entries(scores).flatMap(([learner, values]) => values.map((value, severity) => ({
    cell: learner, learner, objective: 'predict', rule: 'backprop', seed: 1, target: 'x', channel: 'sight',
    kind: 'gaussian', severity, parameter: severity, measure: 'score' as const, metric: 'r2' as const, value, vary: {},
  })));
}

describe('robustnessTable', () => {
  it('gives the Hendrycks & Dietterich (2019) CE and relative CE of a hand example', () => {
    // learner 0.9, 0.8, 0.6; baseline 0.9, 0.6, 0.4 (severities 0, 1, 2). By hand:
    // area = (0.85 + 0.7) / (0.9 · 2) = 0.861 (baseline: (0.75 + 0.5) / 1.8 = 0.694); drop = 0.9 − 0.7 = 0.2;
    // CE = (0.2 + 0.4) / (0.4 + 0.6) = 0.6; relative CE = (0.1 + 0.3) / (0.3 + 0.5) = 0.5.
    const lines = robustnessTable(rows({ l: [0.9, 0.8, 0.6], b: [0.9, 0.6, 0.4] }), 'b');
    expect(lines[2]).toBe('| l | 0.861 | 0.200 | 0.600 | 0.500 |');
    expect(lines[3]).toBe('| b | 0.694 | 0.400 | 1.000 | 1.000 |');
    expect(lines.length).toBe(4);
  });

  it('says why a figure is n/a instead of printing Infinity', () => {
    // CE = (1 − (−0.2)) / (1 − 0.5) = 2.4 (by hand); the baseline does not degrade, so relative CE is undefined.
    const lines = robustnessTable(rows({ l: [-0.1, -0.2], b: [0.5, 0.5] }), 'b');
    expect(lines[2]).toBe('| l | n/a | 0.100 | 2.400 | n/a |');
    expect(lines.at(-1)).toBe('n/a: l normalised area: the clean score -0.1 is not positive; '
      + 'l relative CE: noise adds no error to the baseline (zero denominator); '
      + 'b relative CE: noise adds no error to the baseline (zero denominator).');
  });

  it('leaves CE columns n/a without a baseline', () => {
    expect(robustnessTable(rows({ l: [0.9, 0.8] }), null)[2]).toBe('| l | 0.944 | 0.100 | n/a | n/a |');
  });
});
