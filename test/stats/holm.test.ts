import { describe, expect, it } from 'vitest';
import { holm } from '../../src/stats/holm.js';

describe('holm', () => {
  it("matches the worked example of the Holm–Bonferroni method (Wikipedia, 'Holm–Bonferroni method', Example; from memory)", () => {
    // Four hypotheses, p = 0.01, 0.04, 0.03, 0.005, α = 0.05. Sorted: 0.005, 0.01, 0.03, 0.04
    // against α/4, α/3, α/2, α: the first two are rejected, then 0.03 > 0.025 stops.
    // Adjusted by hand (Holm 1979): 4·0.005 = 0.02, 3·0.01 = 0.03, max(0.03, 2·0.03) = 0.06,
    // max(0.06, 1·0.04) = 0.06.
    const adjusted = holm([0.01, 0.04, 0.03, 0.005]);
    const expected = [0.03, 0.06, 0.06, 0.02];
    adjusted.forEach((p, i) => expect(p).toBeCloseTo(expected[i], 12));
    expect(adjusted.map((p) => p < 0.05)).toEqual([true, false, false, true]);
  });

  it('caps adjusted values at 1', () => {
    expect(holm([0.6, 0.9])).toEqual([1, 1]);
  });

  it('passes NaN through and leaves it out of m', () => {
    const adjusted = holm([0.01, NaN, 0.04]);
    expect(adjusted[0]).toBeCloseTo(0.02, 12);
    expect(adjusted[1]).toBeNaN();
    expect(adjusted[2]).toBeCloseTo(0.04, 12);
  });

  it('returns an empty list for no p-values and rejects values outside [0, 1]', () => {
    expect(holm([])).toEqual([]);
    expect(() => holm([1.2])).toThrow('holm: p-values must lie in [0, 1] or be NaN, got 1.2');
  });
});
