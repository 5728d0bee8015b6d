import type { ChannelName } from '../senses/channel.js';
import type { NoiseKindDefinition } from './kind-definition.js';

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
  /** A built-in kind (NOISE_KINDS) or a plug-in's name. */
  readonly kind: string;
  readonly severities: readonly number[];
  readonly parameters?: readonly number[];
  /** A plug-in kind's definition, attached where the plug-in is loaded; never stored or sent between threads. */
  readonly definition?: NoiseKindDefinition;
}
