import type { Rng } from '../random.js';
import { bandPass, noisePowerGain, type Biquad } from './band-pass.js';

/** Samples per second of the rendered audio. */
export const SAMPLE_RATE_HZ = 44_100;
/** Seconds of audio per step of the walk. */
export const STEP_SECONDS = 0.1;
/** The band level whose noise has an RMS of full scale (1.0): 100 dB SPL = 0 dBFS, common practice. */
export const FULL_SCALE_DB = 100;
/** Seconds over which a band's gain moves from one step's level to the next. */
export const CROSSFADE_SECONDS = 0.01;

/** The RMS amplitude, in full-scale units, of a band at `levelDb`: 10^((L − 100) / 20). */
export function bandRms(levelDb: number): number {
  return 10 ** ((levelDb - FULL_SCALE_DB) / 20);
}

/**
 * Edges of the bands around their centres, in Hz: between two neighbours, their
 * geometric mean; outside the first and last band, the mirror of the inner edge (one
 * octave around a lone band). Returns bands + 1 edges.
 */
export function bandEdgesHz(centresHz: ArrayLike<number>): Float64Array {
  const n = centresHz.length;
  const edges = new Float64Array(n + 1);
  for (let b = 1; b < n; b++) edges[b] = Math.sqrt(centresHz[b - 1] * centresHz[b]);
  edges[0] = n === 1 ? centresHz[0] / Math.SQRT2 : centresHz[0] ** 2 / edges[1];
  edges[n] = n === 1 ? centresHz[0] * Math.SQRT2 : centresHz[n - 1] ** 2 / edges[n - 1];
  return edges;
}

/** Why the bands cannot be rendered at SAMPLE_RATE_HZ (the top band reaches past half of it), or null. */
export function audioBandsProblem(centresHz: ArrayLike<number>): string | null {
  const top = bandEdgesHz(centresHz)[centresHz.length];
  const nyquistHz = SAMPLE_RATE_HZ / 2;
  if (top < nyquistHz) return null;
  return `the top sound band (centre ${Math.round(centresHz[centresHz.length - 1])} Hz) reaches ${Math.round(top)} Hz, past the ${nyquistHz} Hz a ${SAMPLE_RATE_HZ / 1000} kHz file can hold`;
}

/** One step of stereo audio, each channel STEP_SECONDS long. */
export interface StereoBlock {
  readonly left: Float32Array;
  readonly right: Float32Array;
}

/**
 * A renderer of a walk's sound channel, one step at a time. Each band is white noise
 * through a band-pass filter at its centre (bandPass), scaled to unit variance, so a
 * band at L dB has RMS bandRms(L). Both ears share each band's noise and differ only in
 * level, so a level difference between the ears is heard as a direction, as with a pan
 * control. Bands add, their noises independent, so their powers add as the sound
 * channel's sources do. A band's gain follows a raised-cosine crossfade over
 * CROSSFADE_SECONDS from one step's level to the next (from silence before the first
 * step) while the noise runs on, so steps join without clicks.
 *
 * The white noise is uniform, √12·(u − ½), one draw per sample: after a band filter it is
 * close to Gaussian whatever the input's distribution (central limit theorem), at a third
 * of a Gaussian draw's cost.
 */
export function createSoundRenderer(centresHz: ArrayLike<number>, rng: Rng): (levelsDb: Float32Array) => StereoBlock {
  const bands = centresHz.length;
  const edges = bandEdgesHz(centresHz);
  const filters: Biquad[] = [];
  const unitGain = new Float64Array(bands);
  for (let b = 0; b < bands; b++) {
    filters.push(bandPass(centresHz[b], Math.log2(edges[b + 1] / edges[b]), SAMPLE_RATE_HZ));
    unitGain[b] = 1 / Math.sqrt(noisePowerGain(filters[b]));
  }
  const state = new Float64Array(4 * bands); // x1, x2, y1, y2 per band
  const previous = new Float64Array(2 * bands); // the last step's RMS per ear and band, silence at first
  const length = Math.round(STEP_SECONDS * SAMPLE_RATE_HZ);
  const fadeLength = Math.round(CROSSFADE_SECONDS * SAMPLE_RATE_HZ);
  const fade = Float64Array.from({ length: fadeLength }, (_, t) => (1 - Math.cos((Math.PI * t) / fadeLength)) / 2);
  const noise = new Float64Array(length);
  return (levelsDb) => {
    if (levelsDb.length !== 2 * bands) throw new Error(`expected ${2 * bands} band levels (two ears × ${bands} bands), got ${levelsDb.length}`);
    const left = new Float32Array(length);
    const right = new Float32Array(length);
    for (let b = 0; b < bands; b++) {
      bandNoise(filters[b], state, 4 * b, unitGain[b], rng, noise);
      mixBand(noise, previous[b], bandRms(levelsDb[b]), fade, left);
      mixBand(noise, previous[bands + b], bandRms(levelsDb[bands + b]), fade, right);
      previous[b] = bandRms(levelsDb[b]);
      previous[bands + b] = bandRms(levelsDb[bands + b]);
    }
    return { left, right };
  };
}

/** Fills `out` with unit-variance band noise, carrying the filter state across calls. */
function bandNoise(filter: Biquad, state: Float64Array, at: number, unitGain: number, rng: Rng, out: Float64Array): void {
  const { b0, b1, b2, a1, a2 } = filter;
  let [x1, x2, y1, y2] = [state[at], state[at + 1], state[at + 2], state[at + 3]];
  for (let t = 0; t < out.length; t++) {
    const x = Math.sqrt(12) * (rng() - 0.5);
    const y = b0 * x + b1 * x1 + b2 * x2 - a1 * y1 - a2 * y2;
    x2 = x1; x1 = x; y2 = y1; y1 = y;
    out[t] = y * unitGain;
  }
  state[at] = x1; state[at + 1] = x2; state[at + 2] = y1; state[at + 3] = y2;
}

/** Adds noise × gain to `out`, the gain crossfading from `fromRms` to `toRms`. */
function mixBand(noise: Float64Array, fromRms: number, toRms: number, fade: Float64Array, out: Float32Array): void {
  for (let t = 0; t < out.length; t++) {
    const gain = t < fade.length ? fromRms + (toRms - fromRms) * fade[t] : toRms;
    out[t] += noise[t] * gain;
  }
}
