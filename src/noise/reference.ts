import type { ChannelName } from '../senses/channel.js';

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
  const n = values.length / size;
  const sum = new Float64Array(size);
  const sumSq = new Float64Array(size);
  let quietest = Infinity;
  for (let r = 0; r < rows.length; r++) {
    const row = rows[r];
    if (!Number.isInteger(row) || row < 0 || row >= n) throw new Error(`channelReference: row ${row} is outside 0..${n - 1}`);
    for (let j = 0; j < size; j++) {
      const v = values[row * size + j];
      sum[j] += v;
      quietest = Math.min(quietest, v);
    }
  }
  const mean = new Float32Array(size);
  for (let j = 0; j < size; j++) mean[j] = sum[j] / rows.length;
  // Second pass around the mean: the one-pass Σx² − n·x̄² loses digits for dB levels near 60.
  for (let r = 0; r < rows.length; r++) {
    for (let j = 0; j < size; j++) {
      const d = values[rows[r] * size + j] - sum[j] / rows.length;
      sumSq[j] += d * d;
    }
  }
  const std = new Float32Array(size);
  for (let j = 0; j < size; j++) std[j] = Math.sqrt(sumSq[j] / rows.length);
  const silence = new Float32Array(size).fill(channel === 'sound' ? quietest : 0);
  return { channel, size, mean, std, silence };
}
