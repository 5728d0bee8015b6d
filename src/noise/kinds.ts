import { normal, type Rng } from '../random.js';
import type { ChannelReference } from './reference.js';

/** One corruption: returns a new [n, size] array; the input is never changed. */
export type Corruption = (
  values: Float32Array, // [n, size]
  size: number,
  parameter: number,
  reference: ChannelReference,
  rng: Rng,
) => Float32Array;

/** Adds N(0, (σ·std_j)²) to entry j, σ in units of that entry's training std. */
export const gaussian: Corruption = (values, size, sigma, reference, rng) => {
  const out = Float32Array.from(values);
  for (let i = 0; i < out.length; i++) out[i] += sigma * reference.std[i % size] * normal(rng);
  return out;
};

/** Silences each entry independently with probability p (see ChannelReference.silence). */
export const dropout: Corruption = (values, size, p, reference, rng) => {
  const out = Float32Array.from(values);
  for (let i = 0; i < out.length; i++) if (rng() < p) out[i] = reference.silence[i % size];
  return out;
};

/** Silences a row's whole channel with probability p, one draw per row. */
export const blackout: Corruption = (values, size, p, reference, rng) => {
  const out = Float32Array.from(values);
  for (let start = 0; start < out.length; start += size) {
    if (rng() < p) out.set(reference.silence, start);
  }
  return out;
};

/**
 * Adds noise to each ear's spectrum at the given SNR, in the power domain.
 *
 * Per row and ear, Ps is the mean band power 10^(L/10) and the noise has mean band
 * power Pn = Ps / 10^(SNR/10), so SNR = 10·log10(Ps/Pn). Each band's noise power is
 * Pn·e with e ~ Exponential(1): the power of white Gaussian noise in one frequency bin
 * is χ² with two degrees of freedom (common practice). Sources add in power, and the
 * result goes back to dB. The sound channel is [2, bands]: left ear, then right ear.
 */
export const masking: Corruption = (values, size, snrDb, _reference, rng) => {
  const out = Float32Array.from(values);
  const bands = size / 2;
  const noiseToSignal = 10 ** (-snrDb / 10);
  for (let start = 0; start < out.length; start += bands) {
    let signalPower = 0;
    for (let b = 0; b < bands; b++) signalPower += 10 ** (values[start + b] / 10);
    const noisePower = (signalPower / bands) * noiseToSignal;
    for (let b = 0; b < bands; b++) {
      const e = -Math.log(1 - rng()); // Exponential(1) by inversion; 1 − u is never 0
      out[start + b] = 10 * Math.log10(10 ** (values[start + b] / 10) + noisePower * e);
    }
  }
  return out;
};
