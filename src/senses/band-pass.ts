/** A second-order filter y[n] = b0·x[n] + b1·x[n−1] + b2·x[n−2] − a1·y[n−1] − a2·y[n−2] (a0 = 1). */
export interface Biquad {
  readonly b0: number;
  readonly b1: number;
  readonly b2: number;
  readonly a1: number;
  readonly a2: number;
}

/**
 * A band-pass filter with 0 dB gain at `centreHz` and `bandwidthOctaves` between its
 * −3 dB points, from the Audio EQ Cookbook (R. Bristow-Johnson): w0 = 2π·f0/fs,
 * α = sin w0 · sinh(ln 2 / 2 · BW · w0 / sin w0), b = [α, 0, −α], a = [1 + α, −2 cos w0, 1 − α].
 */
export function bandPass(centreHz: number, bandwidthOctaves: number, sampleRateHz: number): Biquad {
  if (!(centreHz > 0 && centreHz < sampleRateHz / 2)) throw new Error(`band centre ${centreHz} Hz must lie between 0 and ${sampleRateHz / 2} Hz`);
  if (!(bandwidthOctaves > 0)) throw new Error(`band width must be more than 0 octaves, got ${bandwidthOctaves}`);
  const w0 = (2 * Math.PI * centreHz) / sampleRateHz;
  const alpha = Math.sin(w0) * Math.sinh(((Math.LN2 / 2) * bandwidthOctaves * w0) / Math.sin(w0));
  const a0 = 1 + alpha;
  return { b0: alpha / a0, b1: 0, b2: -alpha / a0, a1: (-2 * Math.cos(w0)) / a0, a2: (1 - alpha) / a0 };
}

/**
 * Σ h[n]² of the filter's impulse response: the output variance per unit input variance
 * of white noise. Summed until the response has decayed below 1e-12 of its energy.
 */
export function noisePowerGain(filter: Biquad): number {
  const { b0, b1, b2, a1, a2 } = filter;
  let [x1, x2, y1, y2] = [0, 0, 0, 0];
  let energy = 0;
  let tail = Infinity;
  for (let n = 0; n < 10_000_000 && tail > 1e-12 * energy; n++) {
    const x = n === 0 ? 1 : 0;
    const y = b0 * x + b1 * x1 + b2 * x2 - a1 * y1 - a2 * y2;
    [x2, x1, y2, y1] = [x1, x, y1, y];
    energy += y * y;
    // Energy still to come is bounded by the state's, which decays geometrically.
    tail = y1 * y1 + y2 * y2;
  }
  return energy;
}
