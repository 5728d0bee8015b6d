import { createRng, type Rng } from '../random.js';
import { CHANNELS, type ChannelName } from '../senses/channel.js';
import type { NoiseKindDefinition } from './kind-definition.js';
import { blackout, dropout, gaussian, masking } from './kinds.js';
import type { ChannelReference } from './reference.js';
import type { NoiseKind, NoiseSpec } from './spec.js';

/** Every built-in noise kind by its config name. */
export const NOISE_KIND_REGISTRY: Readonly<Record<NoiseKind, NoiseKindDefinition>> = { gaussian, dropout, blackout, masking };

/** The channels a noise kind may corrupt. */
export function kindChannels(kind: NoiseKindDefinition): readonly ChannelName[] {
  return kind.channels ?? CHANNELS;
}

/** The channels each built-in kind may corrupt; masking is an acoustic notion, so sound only. */
export const NOISE_CHANNELS: Readonly<Record<NoiseKind, readonly ChannelName[]>> = {
  gaussian: kindChannels(gaussian),
  dropout: kindChannels(dropout),
  blackout: kindChannels(blackout),
  masking: kindChannels(masking),
};

/** The definition of a spec's kind: the plug-in's it carries, or the built-in of that name. */
export function noiseKindOf(spec: Pick<NoiseSpec, 'kind' | 'definition'>): NoiseKindDefinition {
  const kind = spec.definition ?? NOISE_KIND_REGISTRY[spec.kind as NoiseKind];
  if (kind == null) throw new Error(`unknown noise kind '${spec.kind}'`);
  return kind;
}

/**
 * The generator for one (seed, channel, kind, severity): shared by every learner of the
 * seed, so all of them are scored on identical corrupted inputs (common random numbers).
 */
export function noiseRng(seed: number, channel: ChannelName, kind: string, severity: number): Rng {
  return createRng(seed, 'noise', channel, kind, severity);
}

/**
 * A corrupted copy of one channel's rows; the input array is left untouched. The kind,
 * channel and parameter are those of a noise entry that passed `noiseProblems`. What the
 * kind returns is checked: as many values as it was given, every one finite.
 */
export function corruptChannel(
  values: Float32Array, // [n, size]
  size: number,
  kind: NoiseKind | NoiseKindDefinition,
  parameter: number,
  reference: ChannelReference,
  rng: Rng,
): Float32Array {
  if (!Number.isInteger(size) || size <= 0 || values.length % size !== 0) {
    throw new Error(`corruptChannel: ${reference.channel} values of length ${values.length} are not rows of size ${size}`);
  }
  if (reference.size !== size) throw new Error(`corruptChannel: reference for ${reference.channel} has size ${reference.size}, values have ${size}`);
  const definition = typeof kind === 'string' ? noiseKindOf({ kind }) : kind;
  const out = definition.corrupt(values, size, parameter, reference, rng);
  if (!(out instanceof Float32Array) || out.length !== values.length) {
    throw new Error(`noise kind '${definition.name}' returned ${out instanceof Float32Array ? `${out.length} values` : 'no Float32Array'}, expected a Float32Array of ${values.length}`);
  }
  const bad = out.findIndex((v) => !Number.isFinite(v));
  if (bad >= 0) throw new Error(`noise kind '${definition.name}' returned ${out[bad]} at entry ${bad} (parameter ${parameter}); every value must be finite`);
  return out;
}
