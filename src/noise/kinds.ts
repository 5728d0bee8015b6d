import { normal } from '../random.js';
import type { NoiseKindDefinition } from './kind-definition.js';

// The built-in noise kinds, each in the shape a plug-in file default-exports
// (kind-definition.ts). Their severity scales form one table:
//
// | kind     | parameter                          | 1    | 2    | 3   | 4   | 5    |
// | -------- | ---------------------------------- | ---- | ---- | --- | --- | ---- |
// | gaussian | σ, in training std of each entry   | 0.25 | 0.5  | 1   | 2   | 4    |
// | dropout  | fraction of entries silenced       | 0.1  | 0.3  | 0.5 | 0.7 | 0.9  |
// | blackout | probability a row is silenced      | 0.1  | 0.3  | 0.5 | 0.7 | 0.9  |
// | masking  | SNR in dB (sound only)             | 20   | 10   | 5   | 0   | −5   |
//
// Common practice, not from a published table: gaussian σ doubles per step, so the
// scale is even in log σ and reaches a noise four times the signal's spread, the way
// graded image corruptions grow roughly geometrically (Hendrycks & Dietterich 2019);
// dropout and blackout step p evenly from mild to nearly total; masking spans the
// speech-in-noise range from nearly clean (+20 dB) to noise louder than the signal
// (−5 dB), where listening tests usually stop.

const probability = { parameter: 'a probability p in [0, 1]', valid: (p: number) => p >= 0 && p <= 1 };

/** Adds N(0, (σ·std_j)²) to entry j, σ in units of that entry's training std. */
export const gaussian: NoiseKindDefinition = {
  type: 'noise',
  name: 'gaussian',
  description: 'adds Gaussian noise scaled by each entry\'s training std',
  clean: 0,
  severities: [0.25, 0.5, 1, 2, 4],
  parameter: 'a std multiple σ ≥ 0',
  valid: (p) => Number.isFinite(p) && p >= 0,
  corrupt(values, size, sigma, reference, rng) {
    const out = Float32Array.from(values);
    for (let i = 0; i < out.length; i++) out[i] += sigma * reference.std[i % size] * normal(rng);
    return out;
  },
};

/** Silences each entry independently with probability p (see ChannelReference.silence). */
export const dropout: NoiseKindDefinition = {
  type: 'noise',
  name: 'dropout',
  description: 'silences each entry independently with probability p',
  clean: 0,
  severities: [0.1, 0.3, 0.5, 0.7, 0.9],
  parameter: 'a fraction p in [0, 1]',
  valid: probability.valid,
  corrupt(values, size, p, reference, rng) {
    const out = Float32Array.from(values);
    for (let i = 0; i < out.length; i++) if (rng() < p) out[i] = reference.silence[i % size];
    return out;
  },
};

/** Silences a row's whole channel with probability p, one draw per row. */
export const blackout: NoiseKindDefinition = {
  type: 'noise',
  name: 'blackout',
  description: 'silences a step\'s whole channel with probability p',
  clean: 0,
  severities: [0.1, 0.3, 0.5, 0.7, 0.9],
  ...probability,
  corrupt(values, size, p, reference, rng) {
    const out = Float32Array.from(values);
    for (let start = 0; start < out.length; start += size) {
      if (rng() < p) out.set(reference.silence, start);
    }
    return out;
  },
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
export const masking: NoiseKindDefinition = {
  type: 'noise',
  name: 'masking',
  description: 'adds noise to each ear\'s spectrum at a given signal-to-noise ratio',
  channels: ['sound'], // an acoustic notion
  clean: Infinity,
  severities: [20, 10, 5, 0, -5],
  parameter: 'an SNR in dB (a finite number, or .inf for clean)',
  valid: (p) => p === Infinity || Number.isFinite(p),
  corrupt(values, size, snrDb, _reference, rng) {
    if (size % 2 !== 0) throw new Error(`masking needs two ears of equal size, got a row of ${size}`);
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
  },
};
