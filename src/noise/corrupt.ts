import { createRng, type Rng } from '../random.js';
import { CHANNELS, type ChannelName } from '../senses/channel.js';
import { blackout, dropout, gaussian, masking, type Corruption } from './kinds.js';
import type { ChannelReference } from './reference.js';
import { MAX_SEVERITY, noiseParameter } from './severity.js';
import { NOISE_KINDS, type NoiseKind, type NoiseSpec } from './spec.js';

/** The corruption of each kind. */
export const CORRUPTIONS: Readonly<Record<NoiseKind, Corruption>> = { gaussian, dropout, blackout, masking };

/** The channels each kind may corrupt; masking is an acoustic notion, so sound only. */
export const NOISE_CHANNELS: Readonly<Record<NoiseKind, readonly ChannelName[]>> = {
  gaussian: CHANNELS,
  dropout: CHANNELS,
  blackout: CHANNELS,
  masking: ['sound'],
};

/** What each kind's parameter means and which values it allows. */
const PARAMETER_RULE: Readonly<Record<NoiseKind, { readonly meaning: string; readonly valid: (p: number) => boolean }>> = {
  gaussian: { meaning: 'a std multiple σ ≥ 0', valid: (p) => Number.isFinite(p) && p >= 0 },
  dropout: { meaning: 'a fraction p in [0, 1]', valid: (p) => p >= 0 && p <= 1 },
  blackout: { meaning: 'a probability p in [0, 1]', valid: (p) => p >= 0 && p <= 1 },
  masking: { meaning: 'an SNR in dB (a finite number, or +Infinity for clean)', valid: (p) => p === Infinity || Number.isFinite(p) },
};

/**
 * The generator for one (seed, channel, kind, severity): shared by every learner of the
 * seed, so all of them are scored on identical corrupted inputs (common random numbers).
 */
export function noiseRng(seed: number, channel: ChannelName, kind: NoiseKind, severity: number): Rng {
  return createRng(seed, 'noise', channel, kind, severity);
}

/** A corrupted copy of one channel's rows; the input array is left untouched. */
export function corruptChannel(
  values: Float32Array, // [n, size]
  size: number,
  kind: NoiseKind,
  parameter: number,
  reference: ChannelReference,
  rng: Rng,
): Float32Array {
  if (!(NOISE_KINDS as readonly string[]).includes(kind)) throw new Error(`noise kind '${kind}' is unknown; expected one of ${NOISE_KINDS.join(', ')}`);
  if (!NOISE_CHANNELS[kind].includes(reference.channel)) {
    throw new Error(`noise kind '${kind}' cannot corrupt channel '${reference.channel}'; it accepts ${NOISE_CHANNELS[kind].join(', ')}`);
  }
  if (!Number.isInteger(size) || size <= 0 || values.length % size !== 0) {
    throw new Error(`corruptChannel: ${reference.channel} values of length ${values.length} are not rows of size ${size}`);
  }
  if (reference.size !== size) throw new Error(`corruptChannel: reference for ${reference.channel} has size ${reference.size}, values have ${size}`);
  if (kind === 'masking' && size % 2 !== 0) throw new Error(`corruptChannel: masking needs two ears of equal size, got a row of ${size}`);
  if (!PARAMETER_RULE[kind].valid(parameter)) throw new Error(`noise ${kind} parameter must be ${PARAMETER_RULE[kind].meaning}, got ${parameter}`);
  return CORRUPTIONS[kind](values, size, parameter, reference, rng);
}

/** Checks a noise spec and returns a one-line problem description, or null when it is valid. */
export function noiseSpecProblem(spec: NoiseSpec): string | null {
  const { channel, kind, severities, parameters } = spec;
  if (!(CHANNELS as readonly string[]).includes(channel)) return `channel '${channel}' is unknown; expected one of ${CHANNELS.join(', ')}`;
  if (!(NOISE_KINDS as readonly string[]).includes(kind)) return `kind '${kind}' is unknown; expected one of ${NOISE_KINDS.join(', ')}`;
  if (!NOISE_CHANNELS[kind].includes(channel)) return `kind '${kind}' cannot corrupt channel '${channel}'; it accepts ${NOISE_CHANNELS[kind].join(', ')}`;
  if (severities.length === 0) return 'severities must list at least one severity';
  const bad = severities.find((s) => !Number.isInteger(s) || s < 0);
  if (bad !== undefined) return `severities must be integers ≥ 0, got ${bad}`;
  if (new Set(severities).size !== severities.length) return `severities must not repeat, got [${severities.join(', ')}]`;
  if (parameters === undefined) {
    const high = severities.find((s) => s > MAX_SEVERITY);
    return high === undefined ? null : `severity ${high} has no tabled parameter (0..${MAX_SEVERITY}); give explicit parameters`;
  }
  if (parameters.length !== severities.length) {
    return `parameters must have one value per severity (${severities.length}), got ${parameters.length}`;
  }
  const i = severities.findIndex((_, k) => !PARAMETER_RULE[kind].valid(noiseParameter(spec, k)));
  return i < 0 ? null : `parameter ${parameters[i]} at severity ${severities[i]} must be ${PARAMETER_RULE[kind].meaning}`;
}

/** Throws a one-line error naming the spec when it is invalid. */
export function checkNoiseSpec(spec: NoiseSpec): void {
  const problem = noiseSpecProblem(spec);
  if (problem !== null) throw new Error(`noise ${spec.channel}/${spec.kind}: ${problem}`);
}
