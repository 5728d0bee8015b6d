import { describe, expect, it } from 'vitest';
import { collect } from '../../src/collect/collector.js';
import { LATENT_NAMES } from '../../src/collect/dataset.js';
import { splitByEpisode } from '../../src/collect/split.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { CHANNELS } from '../../src/senses/channel.js';
import { loadWorld } from '../../src/world/parse.js';

const world = loadWorld('worlds/greenhouse.yaml');
const options = { policy: 'wander' as const, steps: 1000, episodeSteps: 50 };

function bytes(array: ArrayBufferView): Buffer {
  return Buffer.from(array.buffer, array.byteOffset, array.byteLength);
}

describe('collect', () => {
  it('gives a byte-identical dataset from the same seed (determinism, STYLE principle 9)', () => {
    for (const policy of ['wander', 'uniform', 'seek'] as const) {
      const a = collect(world, { ...options, policy }, DEFAULT_SENSE_SETTINGS, 7);
      const b = collect(world, { ...options, policy }, DEFAULT_SENSE_SETTINGS, 7);
      for (const c of CHANNELS) expect(bytes(a.channels[c]).equals(bytes(b.channels[c]))).toBe(true);
      for (const n of LATENT_NAMES) expect(bytes(a.latents[n]).equals(bytes(b.latents[n]))).toBe(true);
      expect(bytes(a.episode).equals(bytes(b.episode))).toBe(true);
    }
  });

  it('gives a different dataset from another seed', () => {
    const a = collect(world, options, DEFAULT_SENSE_SETTINGS, 7);
    const b = collect(world, options, DEFAULT_SENSE_SETTINGS, 8);
    expect(bytes(a.latents.x).equals(bytes(b.latents.x))).toBe(false);
  });

  it('sizes every channel [steps, size] and every latent [steps]', () => {
    const d = collect(world, options, DEFAULT_SENSE_SETTINGS, 1);
    expect(d.channelSize).toEqual({ sight: 60, sound: 32, touch: 8, motor: 5 });
    for (const c of CHANNELS) expect(d.channels[c]).toHaveLength(1000 * d.channelSize[c]);
    for (const n of LATENT_NAMES) expect(d.latents[n]).toHaveLength(1000);
  });

  it('numbers episodes and marks the last step of each as having no next step', () => {
    const d = collect(world, { ...options, steps: 120 }, DEFAULT_SENSE_SETTINGS, 1);
    expect([d.episode[0], d.episode[49], d.episode[50], d.episode[119]]).toEqual([0, 0, 1, 2]);
    expect([d.hasNext[48], d.hasNext[49], d.hasNext[50], d.hasNext[119]]).toEqual([1, 0, 1, 0]);
  });

  it('starts the first episode at the world start pose, with action stay', () => {
    const d = collect(world, options, DEFAULT_SENSE_SETTINGS, 3);
    expect([d.latents.x[0], d.latents.y[0], d.latents.heading[0]]).toEqual([2, 7, 1]);
    expect([...d.channels.motor.subarray(0, 5)]).toEqual([0, 0, 0, 0, 1]);
  });

  it('only ever stands on free cells and moves at most one cell per step within an episode', () => {
    const d = collect(world, { ...options, policy: 'uniform' }, DEFAULT_SENSE_SETTINGS, 2);
    for (let t = 0; t < d.steps; t++) {
      expect(world.solid[d.latents.y[t] * world.width + d.latents.x[t]]).toBe(0);
      if (d.hasNext[t] === 1) {
        const jump = Math.abs(d.latents.x[t + 1] - d.latents.x[t]) + Math.abs(d.latents.y[t + 1] - d.latents.y[t]);
        expect(jump).toBe(d.latents.moved[t + 1]);
      }
    }
  });

  it('names the classes of categorical latents', () => {
    const d = collect(world, { ...options, steps: 10 }, DEFAULT_SENSE_SETTINGS, 1);
    expect(d.classNames.heading).toEqual(['north', 'east', 'south', 'west']);
    expect(d.classNames.nearest_emitter).toEqual(['fan', 'tap']);
    expect(d.classNames.material_under).toContain('gravel');
  });

  it('rejects an unknown policy and a zero episode length with a message naming them', () => {
    expect(() => collect(world, { ...options, policy: 'roam' as 'wander' }, DEFAULT_SENSE_SETTINGS, 1)).toThrow("unknown policy 'roam'");
    expect(() => collect(world, { ...options, episodeSteps: 0 }, DEFAULT_SENSE_SETTINGS, 1)).toThrow('collect episodeSteps must be a whole number >= 1, got 0');
  });
});

describe('splitByEpisode', () => {
  const d = collect(world, { ...options, steps: 2000, episodeSteps: 40 }, DEFAULT_SENSE_SETTINGS, 5);
  const split = splitByEpisode(d, { train: 0.7, validation: 0.15, test: 0.15 }, 5);

  it('puts every step in exactly one split', () => {
    const all = [...split.train, ...split.validation, ...split.test].sort((a, b) => a - b);
    expect(all).toEqual(Array.from({ length: 2000 }, (_, i) => i));
  });

  it('never puts one episode in two splits', () => {
    const episodesOf = (steps: Int32Array) => new Set([...steps].map((t) => d.episode[t]));
    const [train, validation, test] = [episodesOf(split.train), episodesOf(split.validation), episodesOf(split.test)];
    for (const e of train) expect(validation.has(e) || test.has(e)).toBe(false);
    for (const e of validation) expect(test.has(e)).toBe(false);
  });

  it('gives each split its fraction of the steps to within one episode (40 steps)', () => {
    expect(Math.abs(split.train.length - 0.7 * 2000)).toBeLessThanOrEqual(40);
    expect(Math.abs(split.validation.length - 0.15 * 2000)).toBeLessThanOrEqual(40);
    expect(Math.abs(split.test.length - 0.15 * 2000)).toBeLessThanOrEqual(40);
  });

  it('is the same for the same seed and shuffles differently for another', () => {
    expect([...splitByEpisode(d, { train: 0.7, validation: 0.15, test: 0.15 }, 5).test]).toEqual([...split.test]);
    expect([...splitByEpisode(d, { train: 0.7, validation: 0.15, test: 0.15 }, 6).test]).not.toEqual([...split.test]);
  });

  it('rejects fractions that do not add up to 1', () => {
    expect(() => splitByEpisode(d, { train: 0.7, validation: 0.2, test: 0.2 }, 1)).toThrow('add up to 1');
  });
});
