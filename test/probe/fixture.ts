import type { Dataset, DatasetSplit, LatentName } from '../../src/collect/dataset.js';
import type { BasisRows } from '../../src/probe/basis.js';
import type { FeatureExtractor } from '../../src/learn/spec.js';
import { createRng, normal, randomInt, type Rng } from '../../src/random.js';
import { CHANNELS, type ChannelName } from '../../src/senses/channel.js';

/**
 * A test fixture, not a world: latents drawn at random and channels that encode them
 * linearly (sight: position, heading, what is ahead; sound: emitter distance and side in
 * dB; touch: movement and floor; motor: a one-hot action), so a linear read-out of a
 * linear encoder can recover exactly what its channels carry. Steps come in episodes
 * of 20; episodes go 14:3:3 to train, validation and test.
 *
 * With `poses`, every step revisits one of that many poses drawn up front, as an agent in
 * a grid does: the pose's latents and its sight row repeat exactly, except the nearest
 * emitter, drawn afresh each step, so one view can carry different labels.
 */
export function fixtureDataset(steps: number, seed: number, poses?: number): { data: Dataset; split: DatasetSplit } {
  const rng = createRng(seed, 'fixture');
  const latents = Object.fromEntries(LATENTS.map((name) => [name, new Float32Array(steps)])) as Record<LatentName, Float32Array>;
  const channelSize: Record<ChannelName, number> = { sight: 11, sound: 8, touch: 5, motor: 5 };
  const channels = Object.fromEntries(CHANNELS.map((c) => [c, new Float32Array(steps * channelSize[c])])) as Record<ChannelName, Float32Array>;
  const revisited = Array.from({ length: poses ?? 0 }, () => {
    const l = drawLatents(rng);
    return { l, sight: sightOf(l, rng) };
  });
  for (let t = 0; t < steps; t++) {
    const pose = poses == null ? undefined : revisited[randomInt(rng, poses)];
    const l = pose === undefined ? drawLatents(rng) : { ...pose.l, nearest_emitter: randomInt(rng, 2) };
    for (const name of LATENTS) latents[name][t] = l[name];
    channels.sight.set(pose === undefined ? sightOf(l, rng) : pose.sight, t * 11);
    channels.sound.set(soundOf(l, rng), t * 8);
    channels.touch.set([l.moved, l.bumped, ...oneHot(l.material_under, 3)], t * 5);
    channels.motor.set(oneHot(l.moved === 1 ? 0 : 2 + randomInt(rng, 3), 5), t * 5);
  }
  const episode = Int32Array.from({ length: steps }, (_, t) => Math.floor(t / 20));
  const hasNext = Uint8Array.from({ length: steps }, (_, t) => (t + 1 < steps && episode[t + 1] === episode[t] ? 1 : 0));
  const part = (t: number) => episode[t] % 20;
  const rowsWhere = (keep: (p: number) => boolean) => Int32Array.from(Array.from({ length: steps }, (_, t) => t).filter((t) => keep(part(t))));
  const data: Dataset = {
    steps, channelSize, channels, latents, episode, hasNext,
    classNames: { heading: ['north', 'east', 'south', 'west'], material_under: ['soil', 'gravel', 'tile'], material_ahead: ['soil', 'gravel', 'tile'], nearest_emitter: ['pump', 'fan'] },
  };
  return { data, split: { train: rowsWhere((p) => p < 14), validation: rowsWhere((p) => p >= 14 && p < 17), test: rowsWhere((p) => p >= 17) } };
}

const LATENTS: readonly LatentName[] = [
  'x', 'y', 'heading', 'material_under', 'material_ahead', 'wall_ahead', 'nearest_emitter',
  'nearest_distance_m', 'nearest_azimuth_deg', 'emitter_in_view', 'moved', 'bumped',
];

function drawLatents(rng: Rng): Record<LatentName, number> {
  const moved = rng() < 0.6 ? 1 : 0;
  return {
    x: 1 + randomInt(rng, 9), y: 1 + randomInt(rng, 7), heading: randomInt(rng, 4),
    material_under: randomInt(rng, 3), material_ahead: randomInt(rng, 3), wall_ahead: rng() < 0.3 ? 1 : 0,
    nearest_emitter: randomInt(rng, 2),
    nearest_distance_m: 0.5 + 4.5 * rng(),
    nearest_azimuth_deg: -180 + 360 * rng(),
    emitter_in_view: rng() < 0.2 ? 1 : 0, moved, bumped: moved === 0 && rng() < 0.3 ? 1 : 0,
  };
}

function sightOf(l: Record<LatentName, number>, rng: Rng): number[] {
  const clean = [l.x / 10, l.y / 10, ...oneHot(l.heading, 4), l.wall_ahead, ...oneHot(l.material_ahead, 3), l.emitter_in_view];
  return clean.map((v) => v + 0.02 * normal(rng));
}

/** Two ears × four bands in dB: inverse-square fall with distance, the source's side louder. */
function soundOf(l: Record<LatentName, number>, rng: Rng): number[] {
  const levels: number[] = [];
  for (const side of [-1, 1]) {
    for (let band = 0; band < 4; band++) {
      const source = 60 - 20 * Math.log10(l.nearest_distance_m) + side * (band + 1) * Math.sin((l.nearest_azimuth_deg * Math.PI) / 180)
        + 2 * Math.cos((l.nearest_azimuth_deg * Math.PI) / 180) + 4 * l.nearest_emitter * (band % 2);
      levels.push(source + 0.2 * normal(rng));
    }
  }
  return levels;
}

function oneHot(index: number, size: number): number[] {
  return Array.from({ length: size }, (_, i) => (i === index ? 1 : 0));
}

/**
 * A fake encoder: a fixed random linear map of the concatenated input channels (in
 * CHANNELS order) to `featureSize` features. Every call's inputs are recorded.
 */
export function linearEncoder(data: Dataset, input: readonly ChannelName[], featureSize: number, seed: number) {
  const rng = createRng(seed, 'fake-encoder');
  const ordered = CHANNELS.filter((c) => input.includes(c));
  const inSize = ordered.reduce((sum, c) => sum + data.channelSize[c], 0);
  const weights = Float64Array.from({ length: inSize * featureSize }, () => normal(rng));
  const calls: Partial<Record<ChannelName, Float32Array>>[] = [];
  const encoder: FeatureExtractor = {
    input: ordered,
    featureSize,
    features(inputs, n) {
      calls.push(inputs);
      const out = new Float32Array(n * featureSize);
      for (let i = 0; i < n; i++) {
        let offset = 0;
        for (const c of ordered) {
          const size = data.channelSize[c];
          const values = inputs[c] as Float32Array;
          for (let j = 0; j < size; j++) {
            const v = values[i * size + j];
            for (let f = 0; f < featureSize; f++) out[i * featureSize + f] += v * weights[(offset + j) * featureSize + f];
          }
          offset += size;
        }
      }
      return out;
    },
    dispose() {},
  };
  return { encoder, calls };
}

/** n rows in basis coordinates stored one by one: row i is z's row i. */
export function everyRow(z: Float64Array, n: number): BasisRows {
  return { z, index: Int32Array.from({ length: n }, (_, i) => i) };
}
