import { describe, expect, it } from 'vitest';
import type { MeasureRow, ScoreRow } from '../../src/results/results-table.js';
import { descriptiveTable, measureTable } from '../../src/report/sections.js';

// Test data: one seed per learner so each mean is the value itself.
function rows(scores: Readonly<Record<string, readonly number[]>>): ScoreRow[] {
  return Object.entries(scores).flatMap(([learner, values]) => values.map((value, severity) => ({
    cell: learner, learner, objective: 'predict', rule: 'backprop', seed: 1, target: 'x', channel: 'sight',
    kind: 'gaussian', severity, parameter: severity, measure: 'score' as const, metric: 'r2' as const, value, vary: {},
  })));
}

describe('descriptiveTable', () => {
  it('gives the Hendrycks & Dietterich (2019, §3) CE and relative CE of a hand example', () => {
    // learner 0.9, 0.8, 0.6; baseline 0.9, 0.6, 0.4 (severities 0, 1, 2). By hand:
    // CE = Σ_s≥1 (1 − score) ratio = (0.2 + 0.4) / (0.4 + 0.6) = 0.6;
    // relative CE = Σ_s≥1 (E_s − E_clean) ratio = (0.1 + 0.3) / (0.3 + 0.5) = 0.5.
    const lines = descriptiveTable(rows({ l: [0.9, 0.8, 0.6], b: [0.9, 0.6, 0.4] }), 'b');
    expect(lines).toEqual(['| learner | CE | relative CE |', '| --- | --- | --- |', '| l | 0.600 | 0.500 |', '| b | 1.000 | 1.000 |']);
  });

  it('says why a figure is n/a instead of printing Infinity', () => {
    // CE = (1 − (−0.2)) / (1 − 0.5) = 2.4 (by hand); the baseline does not degrade, so relative CE is undefined.
    const lines = descriptiveTable(rows({ l: [-0.1, -0.2], b: [0.5, 0.5] }), 'b');
    expect(lines[2]).toBe('| l | 2.400 | n/a |');
    expect(lines.at(-1)).toBe('n/a: l relative CE: noise adds no error to the baseline (zero denominator); '
      + 'b relative CE: noise adds no error to the baseline (zero denominator).');
  });
});

describe('measureTable', () => {
  const measure = (learner: string, seed: number, name: MeasureRow['measure'], value: number): MeasureRow => ({
    ...rows({ [learner]: [0] })[0], seed, severity: null, parameter: null, measure: name, value,
  });

  it('gives mean ± 95% CI half-width per measure and says in how many seeds the area was undefined', () => {
    // noisy 0.2, 0.4: mean 0.3, sd 0.141421, half-width t(0.975, 1) · 0.141421 / √2 = 12.7062 · 0.1 = 1.271 (t from standard tables).
    const lines = measureTable([
      measure('l', 1, 'noisy', 0.2), measure('l', 1, 'drop', 0.1), measure('l', 1, 'area', NaN),
      measure('l', 2, 'noisy', 0.4), measure('l', 2, 'drop', 0.1), measure('l', 2, 'area', 0.8),
    ]);
    expect(lines.slice(0, 3)).toEqual(['| learner | noisy | drop | area |', '| --- | --- | --- | --- |',
      '| l | 0.300 ± 1.271 (n=2) | 0.100 ± 0.000 (n=2) | 0.800 (n=1) |']);
    expect(lines.at(-1)).toBe('area n/a (a corrected clean score below 0.05 leaves nothing to keep a share of): l in 1 of 2 seeds.');
  });
});
