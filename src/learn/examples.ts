import type { Dataset, LatentName } from '../collect/dataset.js';
import type { ChannelName } from '../senses/channel.js';
import { datasetRows, fitStandardiser, orderedChannels, standardise, type Matrix, type Standardiser } from './matrix.js';

/** Training examples of one split, as the towers and the loss need them. */
export interface ExampleSet {
  readonly n: number;
  /** One standardised input matrix per tower, [n, inputWidth]. */
  readonly inputs: readonly Matrix[];
  /** Extra head input of the first tower (forecast: the action), [n, extraWidth]. */
  readonly extra: Matrix | null;
  /** What the loss compares against, [n, targetWidth]; null when the loss needs none. */
  readonly target: Matrix | null;
}

/** Standardisers fitted on the training split only, computed once and shared by every split. */
export class TrainingStatistics {
  private readonly cache = new Map<string, Standardiser>();

  constructor(readonly data: Dataset, readonly trainSteps: Int32Array) {}

  /** Column statistics of channels (CHANNELS order) over the training steps. */
  channels(channels: readonly ChannelName[]): Standardiser {
    const key = orderedChannels(channels).join('+');
    let s = this.cache.get(key);
    if (s == null) {
      s = fitStandardiser(datasetRows(this.data, channels, this.trainSteps));
      this.cache.set(key, s);
    }
    return s;
  }

  /** Mean and std of one continuous latent over the training steps. */
  latent(name: LatentName): Standardiser {
    const key = `latent:${name}`;
    let s = this.cache.get(key);
    if (s == null) {
      const values = Float32Array.from(this.trainSteps, (t) => this.data.latents[name][t]);
      s = fitStandardiser({ rows: values.length, cols: 1, data: values });
      this.cache.set(key, s);
    }
    return s;
  }

  /** Standardised channel rows at the given steps. */
  standardised(channels: readonly ChannelName[], steps: ArrayLike<number>): Matrix {
    return standardise(datasetRows(this.data, channels, steps), this.channels(channels));
  }
}

/** Each step shifted by one (the successor rows of a transition). */
export function nextSteps(steps: Int32Array): Int32Array {
  return steps.map((t) => t + 1);
}
