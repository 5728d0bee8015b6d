import type { ChannelName } from '../senses/channel.js';
import { columnStatistics } from '../stats/columns.js';

/**
 * What a corruption needs to know about a channel's training data.
 *
 * `silence` is the value an entry takes when dropout or blackout removes it. For sight,
 * touch and motor, "nothing" is 0: a dark cell, no contact or vibration, no efference
 * copy. Sound is in dB, where 0 dB would be a level quieter than the world ever is,
 * because its ambient floor is added to every band of every step; so a silenced band
 * takes the ambient floor instead, estimated as the quietest band level heard anywhere
 * in the training rows (the floor is the same in every band, and some band of some step
 * is far from every source).
 */
export interface ChannelReference {
  readonly channel: ChannelName;
  readonly size: number;
  /** Training mean of each entry. */
  readonly mean: Float32Array; // [size]
  /** Training standard deviation of each entry (population form, divisor n). */
  readonly std: Float32Array; // [size]
  /** The value of a silenced entry, in the channel's own units. */
  readonly silence: Float32Array; // [size]
}

/** Per-entry mean, std and silence level of a channel over the given training rows. */
export function channelReference(
  values: Float32Array, // [n, size]
  size: number,
  rows: ArrayLike<number>,
  channel: ChannelName,
): ChannelReference {
  if (!Number.isInteger(size) || size <= 0 || values.length % size !== 0) {
    throw new Error(`channelReference: ${channel} values of length ${values.length} are not rows of size ${size}`);
  }
  if (rows.length === 0) throw new Error(`channelReference: ${channel} needs at least one training row`);
  const { mean, std } = columnStatistics(values, size, { kind: 'keep' }, rows);
  const silence = new Float32Array(size).fill(channel === 'sound' ? quietest(values, size, rows) : 0);
  return { channel, size, mean: Float32Array.from(mean), std: Float32Array.from(std), silence };
}

/** The lowest value of any entry in the given rows. */
function quietest(values: Float32Array, size: number, rows: ArrayLike<number>): number {
  let lowest = Infinity;
  for (let r = 0; r < rows.length; r++) {
    for (let j = 0; j < size; j++) lowest = Math.min(lowest, values[rows[r] * size + j]);
  }
  return lowest;
}
