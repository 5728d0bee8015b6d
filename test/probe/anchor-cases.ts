import type { ChannelName } from '../../src/senses/channel.js';
import type { NoiseSpec } from '../../src/noise/spec.js';

/** A fixed probe workload whose scores are stored as a regression anchor. */
export interface AnchorCase {
  readonly name: string;
  readonly steps: number;
  readonly seed: number;
  readonly poses?: number;
  readonly input: readonly ChannelName[];
  readonly featureSize: number;
  readonly encoderSeed: number;
  readonly targets: readonly string[];
  readonly noise: readonly NoiseSpec[];
  readonly noiseSeed: number;
}

const TARGETS = ['x', 'heading', 'wall_ahead', 'material_ahead', 'nearest_emitter', 'nearest_distance_m', 'nearest_azimuth_deg'];

/** Every row distinct (continuous latents); every step a revisited pose (rows repeat, as in a grid world); 4200 training rows, above the 3000 of the logistic penalty path. */
export const ANCHOR_CASES: readonly AnchorCase[] = [
  {
    name: 'distinct rows', steps: 2000, seed: 11, input: ['sight', 'sound'], featureSize: 16, encoderSeed: 5, targets: TARGETS, noiseSeed: 3,
    noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 1, 2, 3, 4, 5] }, { channel: 'sound', kind: 'masking', severities: [0, 1, 3, 5] }],
  },
  {
    name: 'revisited poses', steps: 2000, seed: 12, poses: 60, input: ['sight'], featureSize: 12, encoderSeed: 8, targets: TARGETS, noiseSeed: 4,
    noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 1, 2, 3, 4, 5] }, { channel: 'sight', kind: 'dropout', severities: [0, 2, 4] }],
  },
  {
    name: 'more training rows than the logistic penalty path uses', steps: 6000, seed: 14, poses: 150, input: ['sight', 'touch'], featureSize: 16, encoderSeed: 9,
    targets: TARGETS, noiseSeed: 5, noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 2, 4] }, { channel: 'touch', kind: 'blackout', severities: [0, 3] }],
  },
];
