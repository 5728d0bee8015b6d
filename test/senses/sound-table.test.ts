import { describe, expect, it } from 'vitest';
import { ildDb } from '../../src/senses/acoustics.js';
import { FarEarGains } from '../../src/senses/sound-table.js';

// The far-ear shadow is ILD(f, θ) = ILD(f, 90°)·|sin θ| (acoustics.ts, after Rayleigh 1907 and
// Feddersen et al. 1957); a source 3 cells across and 4 along lies at |sin θ| = 3/5 facing
// north or south and 4/5 facing east or west (a 3-4-5 triangle, by hand).
describe('FarEarGains', () => {
  const bandsHz = Float64Array.of(250, 1000, 4000);
  const gains = new FarEarGains(bandsHz, 10);

  it('gives the power gain 10^(−ILD/10) at the azimuth of the offset, for both facings', () => {
    const g = gains.at(3, 4);
    bandsHz.forEach((hz, b) => {
      expect(g[b]).toBeCloseTo(10 ** (-ildDb(hz, (Math.asin(3 / 5) * 180) / Math.PI) / 10), 12);
      expect(g[3 + b]).toBeCloseTo(10 ** (-ildDb(hz, (Math.asin(4 / 5) * 180) / Math.PI) / 10), 12);
    });
  });

  it('depends on |dx| and |dy| only, so mirrored offsets share one entry', () => {
    expect(gains.at(-3, 4)).toBe(gains.at(3, -4));
  });

  it('leaves a source straight ahead and one at the listener unshadowed (gain 1 facing north/south)', () => {
    expect(Array.from(gains.at(0, 5).subarray(0, 3))).toEqual([1, 1, 1]);
    expect(Array.from(gains.at(0, 0))).toEqual([1, 1, 1, 1, 1, 1]);
  });
});
