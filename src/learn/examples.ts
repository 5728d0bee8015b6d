import { LATENT_KIND, type Dataset, type LatentName } from '../collect/dataset.js';
import type { ChannelName } from '../senses/channel.js';
import { datasetRows, fitStandardiser, orderedChannels, standardise, withSuccessor, type Matrix, type Standardiser } from './matrix.js';
import type { ExampleSource } from './objective-definition.js';

export type { ExampleSet } from './objective-definition.js';

/** Standardisers fitted on the training split only, computed once and shared by every split. */
export class TrainingStatistics implements ExampleSource {
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
  latentStatistics(name: LatentName): Standardiser {
    const key = `latent:${name}`;
    let s = this.cache.get(key);
    if (s == null) {
      const values = Float32Array.from(this.trainSteps, (t) => this.data.latents[name][t]);
      s = fitStandardiser({ rows: values.length, cols: 1, data: values });
      this.cache.set(key, s);
    }
    return s;
  }

  standardised(channels: readonly ChannelName[], steps: ArrayLike<number>): Matrix {
    return standardise(datasetRows(this.data, channels, steps), this.channels(channels));
  }

  raw(channels: readonly ChannelName[], steps: ArrayLike<number>): Matrix {
    return datasetRows(this.data, channels, steps);
  }

  withNext(steps: Int32Array): Int32Array {
    return withSuccessor(this.data, steps);
  }

  latent(name: LatentName, steps: ArrayLike<number>): Float32Array {
    const values = this.data.latents[name];
    if (LATENT_KIND[name] !== 'continuous') return Float32Array.from(steps, (t) => values[t]);
    const { mean, std } = this.latentStatistics(name);
    return Float32Array.from(steps, (t) => (values[t] - mean[0]) / std[0]);
  }
}

/** Each step shifted by one (the successor rows of a transition). */
export function nextSteps(steps: Int32Array): Int32Array {
  return steps.map((t) => t + 1);
}
