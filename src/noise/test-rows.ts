import type { Dataset, DatasetSplit } from '../collect/dataset.js';
import type { ChannelName } from '../senses/channel.js';
import { corruptChannel, noiseRng } from './corrupt.js';
import { channelReference, type ChannelReference } from './reference.js';
import type { NoiseKind } from './spec.js';

/** The spread and silence level a channel's test noise is scaled by: the channel over the training split. */
export function trainingReference(data: Dataset, split: DatasetSplit, channel: ChannelName): ChannelReference {
  return channelReference(data.channels[channel], data.channelSize[channel], split.train, channel);
}

/**
 * A channel's test rows ([nTest, size], in split.test order) corrupted at one severity,
 * as the probes score them: scaled by the training reference, with draws from the seed's
 * stream for (channel, kind, severity), so every learner of a seed, and a recording of
 * the seed, sees the same corrupted inputs.
 */
export function corruptTestRows(
  testRows: Float32Array, reference: ChannelReference, kind: NoiseKind, severity: number, parameter: number, seed: number,
): Float32Array {
  return corruptChannel(testRows, reference.size, kind, parameter, reference, noiseRng(seed, reference.channel, kind, severity));
}
