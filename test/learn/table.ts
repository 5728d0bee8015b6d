import { LATENT_NAMES, type Dataset, type DatasetSplit, type LatentName } from '../../src/collect/dataset.js';
import type { ChannelName } from '../../src/senses/channel.js';

/**
 * A dataset from a plain table: features become the `sight` channel, labels the
 * categorical latent `material_under`; every row is its own one-step episode.
 */
export function tableDataset(features: readonly (readonly number[])[], labels: readonly number[], classNames: readonly string[]): Dataset {
  const n = features.length;
  const width = features[0].length;
  const size: Record<ChannelName, number> = { sight: width, sound: 0, touch: 0, motor: 0 };
  const latents = Object.fromEntries(LATENT_NAMES.map((name) => [name, new Float32Array(n)])) as Record<LatentName, Float32Array>;
  latents.material_under.set(labels);
  return {
    steps: n,
    channelSize: size,
    channels: { sight: Float32Array.from(features.flat()), sound: new Float32Array(0), touch: new Float32Array(0), motor: new Float32Array(0) },
    latents,
    episode: Int32Array.from({ length: n }, (_, i) => i),
    hasNext: new Uint8Array(n),
    classNames: { material_under: classNames },
  };
}

/** Rows i with i mod 5 = 0 to test, = 1 to validation, the rest to train (stratified when classes are in blocks). */
export function everyFifthSplit(n: number): DatasetSplit {
  const rows = Array.from({ length: n }, (_, i) => i);
  return {
    train: Int32Array.from(rows.filter((i) => i % 5 >= 2)),
    validation: Int32Array.from(rows.filter((i) => i % 5 === 1)),
    test: Int32Array.from(rows.filter((i) => i % 5 === 0)),
  };
}
