import * as tf from '@tensorflow/tfjs-core';
import type { ChannelName } from '../senses/channel.js';
import { gatherChannels, orderedChannels, standardise, type Standardiser } from './matrix.js';
import { disposeTower, encode, layerWidth, type Tower } from './network.js';
import type { FeatureExtractor } from './spec.js';

/** Rows per forward pass when extracting features, to bound memory on large inputs. */
const CHUNK_ROWS = 4096;

/** A frozen encoder as a function of standardised input rows. */
export interface Representation {
  readonly featureSize: number;
  /** Features of standardised rows x ([rows, cols]), [rows, featureSize]; called inside tf.tidy. */
  features(x: Float32Array, rows: number, cols: number): tf.Tensor2D;
  dispose(): void;
}

/** The representation of a rate tower without head: its last hidden layer's activations. */
export function rateRepresentation(tower: Tower): Representation {
  return {
    featureSize: layerWidth(tower.encoder[tower.encoder.length - 1]),
    features: (x, rows, cols) => encode(tower, tf.tensor2d(x, [rows, cols])),
    dispose: () => disposeTower(tower),
  };
}

/** Wraps a trained representation and its training-split standardiser. */
export function createExtractor(
  input: readonly ChannelName[],
  channelSize: Readonly<Record<ChannelName, number>>,
  representation: Representation,
  standardiser: Standardiser,
): FeatureExtractor {
  const channels = orderedChannels(input);
  const { featureSize } = representation;
  return {
    input: channels,
    featureSize,
    features(inputs, n) {
      for (const c of channels) {
        const values = inputs[c];
        if (values == null) throw new Error(`features: input channel '${c}' is missing`);
        if (values.length !== n * channelSize[c]) {
          throw new Error(`features: channel '${c}' has ${values.length} values, expected ${n} × ${channelSize[c]}`);
        }
      }
      const x = standardise(gatherChannels(inputs, channelSize, channels, Int32Array.from({ length: n }, (_, i) => i)), standardiser);
      const out = new Float32Array(n * featureSize); // [n, featureSize]
      for (let start = 0; start < n; start += CHUNK_ROWS) {
        const rows = Math.min(CHUNK_ROWS, n - start);
        const chunk = x.data.subarray(start * x.cols, (start + rows) * x.cols);
        // The tensor, not its values, leaves tidy: tidy walks a returned typed array element by element.
        const features = tf.tidy(() => representation.features(chunk, rows, x.cols));
        try {
          out.set(features.dataSync(), start * featureSize);
        } finally {
          features.dispose();
        }
      }
      return out;
    },
    dispose: () => representation.dispose(),
  };
}
