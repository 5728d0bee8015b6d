import { describe, expect, it } from 'vitest';
import { createRng } from '../../src/random.js';
import { bandPass, noisePowerGain, type Biquad } from '../../src/senses/band-pass.js';
import { audioBandsProblem, bandEdgesHz, bandRms, createSoundRenderer, SAMPLE_RATE_HZ } from '../../src/senses/sound-synthesis.js';

const FS = 44_100;

/** |H(e^{jω})| of a biquad at `hz`, evaluated directly from its coefficients. */
function gainAt(f: Biquad, hz: number): number {
  const w = (2 * Math.PI * hz) / FS;
  const re = (c: number[]) => c[0] + c[1] * Math.cos(w) + c[2] * Math.cos(2 * w);
  const im = (c: number[]) => c[1] * Math.sin(w) + c[2] * Math.sin(2 * w);
  const [b, a] = [[f.b0, f.b1, f.b2], [1, f.a1, f.a2]];
  return Math.hypot(re(b), im(b)) / Math.hypot(re(a), im(a));
}

const rms = (x: ArrayLike<number>, from = 0, to = x.length) => {
  let sum = 0;
  for (let i = from; i < to; i++) sum += x[i] * x[i];
  return Math.sqrt(sum / (to - from));
};
const db = (ratio: number) => 20 * Math.log10(ratio);

describe('bandPass (Audio EQ Cookbook band-pass, 0 dB peak)', () => {
  it.each([[100, 1], [1000, 1 / 3]])('passes %d Hz at 0 dB and is 3 dB down at the band edges (%f octaves)', (hz, octaves) => {
    const f = bandPass(hz, octaves, FS);
    expect(gainAt(f, hz)).toBeCloseTo(1, 9);
    // −3 dB is a gain of 1/√2 at f0·2^(±BW/2) (the cookbook's definition of BW).
    expect(gainAt(f, hz * 2 ** (octaves / 2))).toBeCloseTo(Math.SQRT1_2, 3);
    expect(gainAt(f, hz * 2 ** (-octaves / 2))).toBeCloseTo(Math.SQRT1_2, 3);
  });

  it('has a white-noise power gain near π·BW/fs: a two-pole resonance\'s noise bandwidth is π/2 times its −3 dB bandwidth (from memory)', () => {
    const f = bandPass(100, 1, FS);
    const bwHz = 100 * (2 ** 0.5 - 2 ** -0.5);
    expect(noisePowerGain(f) / ((Math.PI * bwHz) / FS)).toBeCloseTo(1, 1.7); // within 1%
  });

  it('gives the output variance of white noise run through the filter (a naive simulation, 2·10⁶ samples, within 2%)', () => {
    const f = bandPass(1000, 1 / 3, FS);
    const rng = createRng(3, 'test');
    let [x1, x2, y1, y2, sum] = [0, 0, 0, 0, 0];
    const n = 2_000_000;
    for (let i = 0; i < n; i++) {
      const x = Math.sqrt(12) * (rng() - 0.5); // unit variance
      const y = f.b0 * x + f.b1 * x1 + f.b2 * x2 - f.a1 * y1 - f.a2 * y2;
      [x2, x1, y2, y1] = [x1, x, y1, y];
      sum += y * y;
    }
    expect(sum / n / noisePowerGain(f)).toBeGreaterThan(0.98);
    expect(sum / n / noisePowerGain(f)).toBeLessThan(1.02);
  });
});

describe('bandEdgesHz', () => {
  it('puts edges at the geometric means of neighbours and mirrors the outer ones: 100, 400 Hz → 50, 200, 800', () => {
    expect([...bandEdgesHz([100, 400])]).toEqual([50, 200, 800]);
  });

  it('gives a lone band one octave', () => {
    const [lo, hi] = bandEdgesHz([1000]);
    expect(Math.log2(hi / lo)).toBeCloseTo(1, 12);
  });
});

describe('audioBandsProblem', () => {
  it('accepts the default bands (top centre 8 kHz) and rejects a top band reaching past 22 050 Hz', () => {
    expect(audioBandsProblem([4000, 8000])).toBeNull();
    // Inner edge √(16000 · 20000) = 17 889 Hz; the top edge mirrors it: 20000² / 17 889 = 22 361 Hz.
    expect(audioBandsProblem([16_000, 20_000])).toBe('the top sound band (centre 20000 Hz) reaches 22361 Hz, past the 22050 Hz a 44.1 kHz file can hold');
  });
});

describe('createSoundRenderer', () => {
  const STEP = 4410;
  const FADE = 441;
  const render = (levels: number[][], centres = [250, 1000, 4000], seed = 1) => {
    const next = createSoundRenderer(centres, createRng(seed, 'test'));
    const blocks = levels.map((l) => next(Float32Array.from(l)));
    const join = (ear: 'left' | 'right') => {
      const out = new Float32Array(blocks.length * STEP);
      blocks.forEach((b, i) => out.set(b[ear], i * STEP));
      return out;
    };
    return { left: join('left'), right: join('right') };
  };
  const silent = -200;

  it('renders 0.1 s per step at 44.1 kHz', () => {
    expect(SAMPLE_RATE_HZ).toBe(44_100);
    expect(render([[60, 60, 60, 60, 60, 60]]).left.length).toBe(STEP);
  });

  it('gives one band at L dB an RMS of 10^((L − 100)/20) full scale (100 dB = 0 dBFS, common practice), within 0.3 dB over 5 s', () => {
    // A 1 kHz band about 500 Hz wide over 5 s: B·T ≈ 2500, so the measured power scatters by ≈ 1/√2500 = 2% (0.1 dB).
    const levels = Array.from({ length: 50 }, () => [silent, 70, silent, silent, 70, silent]);
    const { left } = render(levels);
    expect(Math.abs(db(rms(left, STEP) / bandRms(70)))).toBeLessThan(0.3);
    expect(bandRms(70)).toBeCloseTo(0.0316228, 6);
  });

  it('adds independent bands in power: three bands at 60 dB sum to 60 + 10·log10(3) = 64.8 dB, within 0.3 dB', () => {
    const { left } = render(Array.from({ length: 50 }, () => [60, 60, 60, 60, 60, 60]));
    expect(Math.abs(db(rms(left, STEP)) - db(bandRms(60 + 10 * Math.log10(3))))).toBeLessThan(0.3);
  });

  it('shares each band\'s noise between the ears, so a 6 dB level difference is an amplitude ratio of 10^(6/20) sample by sample', () => {
    const { left, right } = render([[66, 66, 66, 60, 60, 60], [66, 66, 66, 60, 60, 60]]);
    for (let t = FADE; t < 2 * STEP; t += 97) expect(left[t] / right[t]).toBeCloseTo(10 ** (6 / 20), 4);
  });

  it('fades a level change in over 10 ms instead of jumping: the first millisecond after a 40 dB rise stays below −20 dB of the new level', () => {
    const { left } = render([[40, 40, 40, 40, 40, 40], [80, 80, 80, 80, 80, 80], [80, 80, 80, 80, 80, 80]]);
    expect(db(rms(left, STEP, STEP + 44) / rms(left, 2 * STEP))).toBeLessThan(-20);
    // The step after the fade carries the new level.
    expect(Math.abs(db(rms(left, STEP + FADE, 2 * STEP) / rms(left, 2 * STEP)))).toBeLessThan(1);
  });

  it('draws the same samples from the same seed and different ones from another', () => {
    const levels = [[60, 50, 40, 60, 50, 40]];
    expect(render(levels).left).toEqual(render(levels).left);
    expect(render(levels, undefined, 2).left).not.toEqual(render(levels).left);
  });
});
