import type { ChannelName } from '../senses/channel.js';

/** Ways a test channel can be corrupted (a noise entry's `kind`). */
export const NOISE_KINDS = ['gaussian', 'dropout', 'blackout', 'masking'] as const;
export type NoiseKind = (typeof NOISE_KINDS)[number];

/**
 * One corruption sweep of one channel. Severity 0 is always clean; 1..5 map to the
 * documented parameter table of the kind unless `parameters` gives explicit values
 * (then parameters[i] is used for severities[i]).
 */
export interface NoiseSpec {
  readonly channel: ChannelName;
  readonly kind: NoiseKind;
  readonly severities: readonly number[];
  readonly parameters?: readonly number[];
}
