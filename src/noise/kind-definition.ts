import type { Rng } from '../random.js';
import type { ChannelName } from '../senses/channel.js';
import type { ChannelReference } from './reference.js';

/** One corruption: returns a new [n, size] array; the input is never changed. */
export type Corruption = (
  values: Float32Array, // [n, size]
  size: number,
  parameter: number,
  reference: ChannelReference,
  rng: Rng,
) => Float32Array;

/**
 * A noise kind, built in or default-exported by a plug-in file (`kind: ./my-noise.ts` in a
 * `noise` entry): how it corrupts a channel's test rows, and its severity scale.
 */
export interface NoiseKindDefinition {
  readonly type: 'noise';
  /** The name results and the summary show; letters, digits, '.', '_' or '-'. */
  readonly name: string;
  /** One line on what it does to a channel. */
  readonly description: string;
  /** Channels it may corrupt; every channel when left out. */
  readonly channels?: readonly ChannelName[];
  /** The parameter that leaves the input unchanged (severity 0). */
  readonly clean: number;
  /** The parameter at severities 1 to 5, mild to severe (5 numbers). */
  readonly severities: readonly number[];
  /** What the parameter is and which values it takes, for messages: "a std multiple σ ≥ 0". */
  readonly parameter: string;
  /** Whether a parameter value is allowed (explicit `parameters` in a config are checked with it). */
  valid(parameter: number): boolean;
  /** A corrupted copy of n rows of one channel; draws randomness from `rng` only. */
  corrupt: Corruption;
}
