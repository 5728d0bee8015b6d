import { describe, expect, it } from 'vitest';
import { distanceLossDb, ildDb, spectrumShapeDb } from '../../src/senses/acoustics.js';

describe('distanceLossDb (inverse-square law, Kinsler et al. 2000 §5.11)', () => {
  it('loses 20·log10 2 = 6.0206 dB per doubling of distance', () => {
    expect(distanceLossDb(2) - distanceLossDb(4)).toBeCloseTo(6.0206, 4);
    expect(distanceLossDb(0.5) - distanceLossDb(1)).toBeCloseTo(6.0206, 4);
  });

  it('is 0 dB at the 1 m reference and floored at 0.25 m (+12.04 dB)', () => {
    expect(distanceLossDb(1)).toBe(-0);
    expect(distanceLossDb(0)).toBeCloseTo(20 * Math.log10(4), 9);
  });
});

describe('spectrumShapeDb', () => {
  it('is 0 dB at the centre and 3 dB down half a bandwidth away (half-power bandwidth)', () => {
    const band = { centreHz: 1000, bandwidthOctaves: 2, levelDb: 60 };
    expect(spectrumShapeDb(band, 1000)).toBe(-0);
    expect(spectrumShapeDb(band, 2000)).toBeCloseTo(-3, 9);
    expect(spectrumShapeDb(band, 500)).toBeCloseTo(-3, 9);
  });
});

describe('ildDb (Feddersen et al. 1957; duplex theory, Rayleigh 1907)', () => {
  it('is zero for a source straight ahead or straight behind', () => {
    expect(ildDb(6000, 0)).toBe(0);
    expect(ildDb(6000, 180)).toBeCloseTo(0, 9);
  });

  it('is about 0 dB near 200 Hz and 10-20 dB near 6 kHz at 90° (Feddersen et al. 1957, from memory)', () => {
    expect(ildDb(200, 90)).toBeLessThan(1);
    expect(ildDb(6000, 90)).toBeGreaterThan(10);
    expect(ildDb(6000, 90)).toBeLessThan(20);
  });

  it('grows with frequency at a fixed azimuth', () => {
    const hz = [200, 500, 1000, 2000, 4000, 8000];
    const ild = hz.map((f) => ildDb(f, 60));
    for (let i = 1; i < ild.length; i++) expect(ild[i]).toBeGreaterThan(ild[i - 1]);
  });

  it('grows with |sin(azimuth)| and is symmetric left/right', () => {
    expect(ildDb(4000, 30)).toBeCloseTo(ildDb(4000, 90) * 0.5, 9);
    expect(ildDb(4000, -45)).toBeCloseTo(ildDb(4000, 45), 9);
  });
});
