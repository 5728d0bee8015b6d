import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../../src/random.js';
import { columnStatistics } from '../../src/stats/columns.js';

/** Naive reference: each column copied out, mean and population std by the textbook formula. */
function naive(values: ArrayLike<number>, cols: number, rows: readonly number[]): { mean: number[]; std: number[] } {
  const mean: number[] = [];
  const std: number[] = [];
  for (let c = 0; c < cols; c++) {
    const column = rows.map((r) => values[r * cols + c]);
    const m = column.reduce((a, b) => a + b, 0) / column.length;
    mean.push(m);
    std.push(Math.sqrt(column.reduce((a, x) => a + (x - m) ** 2, 0) / column.length));
  }
  return { mean, std };
}

describe('columnStatistics', () => {
  // Rows (1, 5), (2, 5), (3, 5), (4, 5). Column 0 by hand: mean 2.5, squared deviations
  // 2.25 + 0.25 + 0.25 + 2.25 = 5, population variance 5/4, std √1.25 = 1.118033988749895.
  // Column 1 is constant: mean 5, std 0.
  const handExample = Float64Array.from([1, 5, 2, 5, 3, 5, 4, 5]);

  it('gives the population mean and std of a hand-worked example', () => {
    const { mean, std } = columnStatistics(handExample, 2, { kind: 'keep' });
    expect(Array.from(mean)).toEqual([2.5, 5]);
    expect(std[0]).toBeCloseTo(1.118033988749895, 15);
    expect(std[1]).toBe(0);
  });

  it('uses only the given rows when rows are listed', () => {
    // Rows 0 and 2 of column 0 are 1 and 3: mean 2, population std 1 (by hand).
    const { mean, std } = columnStatistics(handExample, 2, { kind: 'keep' }, [0, 2]);
    expect(Array.from(mean)).toEqual([2, 5]);
    expect(Array.from(std)).toEqual([1, 0]);
  });

  it('counts a weighted row as that many copies of itself', () => {
    // Rows 0 and 2 weighted 3 and 1 stand for 1, 1, 1, 3 in column 0: mean 6/4 = 1.5,
    // squared deviations 3·0.25 + 2.25 = 3, population std √(3/4) (by hand).
    const { mean, std } = columnStatistics(handExample, 2, { kind: 'keep' }, [0, 2], [3, 1]);
    expect(Array.from(mean)).toEqual([1.5, 5]);
    expect(std[0]).toBeCloseTo(Math.sqrt(0.75), 15);
    expect(std[1]).toBe(0);
  });

  it('gives a constant column std 1 under unit-below, leaving spread columns alone', () => {
    const { std } = columnStatistics(handExample, 2, { kind: 'unit-below', tolerance: 1e-6 });
    expect(std[0]).toBeCloseTo(1.118033988749895, 15);
    expect(std[1]).toBe(1);
  });

  it('tells unit-below (absolute) from zero-relative (a fraction of the mean)', () => {
    // One column 1000 ± 1e-4: std 1e-4 (by hand), above the absolute 1e-6 but at most 1e-6 · 1000.
    const nearlyConstant = Float64Array.from([1000 - 1e-4, 1000 + 1e-4]);
    const unit = columnStatistics(nearlyConstant, 1, { kind: 'unit-below', tolerance: 1e-6 });
    expect(unit.std[0]).toBeCloseTo(1e-4, 12);
    const relative = columnStatistics(nearlyConstant, 1, { kind: 'zero-relative', tolerance: 1e-6 });
    expect(relative.std[0]).toBe(0);
    expect(columnStatistics(handExample, 2, { kind: 'zero-relative', tolerance: 1e-6 }).std[1]).toBe(0);
  });

  it('matches a naive per-column computation on float32 data around a large mean', () => {
    // Levels near 60 dB with unit spread, as sound bands are: the one-pass Σx² − n·x̄² form
    // would lose digits here (Chan, Golub & LeVeque 1983); the naive two-pass loop does not.
    const rng = createRng(7, 'test');
    const n = 500;
    const cols = 6;
    const values = Float32Array.from({ length: n * cols }, (_, i) => 60 + (i % cols) + normal(rng));
    const rows = Array.from({ length: n }, (_, i) => i).filter((i) => i % 3 !== 0);
    const expected = naive(values, cols, rows);
    const { mean, std } = columnStatistics(values, cols, { kind: 'keep' }, rows);
    for (let c = 0; c < cols; c++) {
      expect(mean[c]).toBeCloseTo(expected.mean[c], 12);
      expect(std[c]).toBeCloseTo(expected.std[c], 12);
      expect(std[c]).toBeGreaterThan(0.8); // unit normal spread, n = 333 (common practice bound)
    }
  });

  it('gives mean 0 and std 0 (then the rule) when there are no rows', () => {
    const none = columnStatistics(new Float32Array(0), 3, { kind: 'unit-below', tolerance: 1e-6 });
    expect(Array.from(none.mean)).toEqual([0, 0, 0]);
    expect(Array.from(none.std)).toEqual([1, 1, 1]);
  });

  it('rejects values that are not whole rows, and rows out of range', () => {
    expect(() => columnStatistics(new Float32Array(5), 2, { kind: 'keep' })).toThrow('columnStatistics: 5 values are not rows of 2 columns');
    expect(() => columnStatistics(handExample, 2, { kind: 'keep' }, [4])).toThrow('columnStatistics: row 4 is outside 0..3');
  });
});
