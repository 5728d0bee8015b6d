import { describe, expect, it } from 'vitest';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { bandCentresHz, hzToMel, melToHz } from '../../src/senses/mel.js';

describe('mel scale (O\'Shaughnessy 1987: m = 2595·log10(1 + f/700))', () => {
  it('maps 1000 Hz to 999.9855 mel (2595·log10(1 + 1000/700), by hand), to 4 decimals', () => {
    expect(Math.abs(hzToMel(1000) - 999.9855)).toBeLessThan(5e-5);
  });

  it('inverts exactly (round trip within 1e-9 Hz)', () => {
    for (const hz of [100, 440, 8000]) expect(melToHz(hzToMel(hz))).toBeCloseTo(hz, 9);
  });
});

describe('bandCentresHz', () => {
  const centres = bandCentresHz(DEFAULT_SENSE_SETTINGS);

  it('has 16 bands from 100 Hz to 8000 Hz by default (DESIGN)', () => {
    expect(centres).toHaveLength(16);
    expect(centres[0]).toBeCloseTo(100, 9);
    expect(centres[15]).toBeCloseTo(8000, 9);
  });

  it('spaces the centres equally in mel', () => {
    const step = hzToMel(centres[1]) - hzToMel(centres[0]);
    for (let b = 1; b < 16; b++) expect(hzToMel(centres[b]) - hzToMel(centres[b - 1])).toBeCloseTo(step, 9);
  });
});
