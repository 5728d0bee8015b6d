import { createRng, type Rng } from '../random.js';
import { CHANNELS, type ChannelName } from '../senses/channel.js';
import { blackout, dropout, gaussian, masking, type Corruption } from './kinds.js';
import type { ChannelReference } from './reference.js';
import type { NoiseKind } from './spec.js';

/** The corruption of each kind. */
export const CORRUPTIONS: Readonly<Record<NoiseKind, Corruption>> = { gaussian, dropout, blackout, masking };

/** The channels each kind may corrupt; masking is an acoustic notion, so sound only. */
export const NOISE_CHANNELS: Readonly<Record<NoiseKind, readonly ChannelName[]>> = {
  gaussian: CHANNELS,
  dropout: CHANNELS,
  blackout: CHANNELS,
  masking: ['sound'],
};

/**
 * The generator for one (seed, channel, kind, severity): shared by every learner of the
 * seed, so all of them are scored on identical corrupted inputs (common random numbers).
 */
export function noiseRng(seed: number, channel: ChannelName, kind: NoiseKind, severity: number): Rng {
  return createRng(seed, 'noise', channel, kind, severity);
}

/**
 * A corrupted copy of one channel's rows; the input array is left untouched. The kind,
 * channel and parameter are those of a noise entry that passed `noiseProblems`.
 */
export function corruptChannel(
  values: Float32Array, // [n, size]
  size: number,
  kind: NoiseKind,
  parameter: number,
  reference: ChannelReference,
  rng: Rng,
): Float32Array {
  if (!Number.isInteger(size) || size <= 0 || values.length % size !== 0) {
    throw new Error(`corruptChannel: ${reference.channel} values of length ${values.length} are not rows of size ${size}`);
  }
  if (reference.size !== size) throw new Error(`corruptChannel: reference for ${reference.channel} has size ${reference.size}, values have ${size}`);
  if (kind === 'masking' && size % 2 !== 0) throw new Error(`corruptChannel: masking needs two ears of equal size, got a row of ${size}`);
  return CORRUPTIONS[kind](values, size, parameter, reference, rng);
}
