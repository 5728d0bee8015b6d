import { describe, expect, it } from 'vitest';
import type { ScoreRow } from '../../src/results/results-table.js';
import { iqmTable } from '../../src/report/sections.js';

// Test data: one learner, ten seeds scoring 0.1, 0.2, …, 1.0 at severity 0.
const rows: ScoreRow[] = Array.from({ length: 10 }, (_, i) => ({
  cell: `c${i}`, learner: 'a', objective: 'predict', rule: 'backprop', seed: i + 1, target: 'x', channel: 'sight',
  kind: 'gaussian', severity: 0, parameter: 0, measure: 'score', metric: 'r2', value: (i + 1) / 10, vary: {},
}));

describe('iqmTable', () => {
  it('shows the interquartile mean with a bootstrap CI that brackets it, reproducibly', () => {
    // IQM of 0.1..1.0: drop floor(10/4) = 2 from each end → mean(0.3..0.8) = 0.55 (by hand).
    const lines = iqmTable(rows, 'test');
    expect(lines[0]).toBe('| learner | severity 0 |');
    const match = /^\| a \| 0\.550 \[([0-9.]+), ([0-9.]+)\] \|$/.exec(lines[2]);
    expect(match).not.toBeNull();
    expect(Number(match![1])).toBeLessThan(0.55);
    expect(Number(match![2])).toBeGreaterThan(0.55);
    expect(iqmTable(rows, 'test')).toEqual(lines);
  });
});
