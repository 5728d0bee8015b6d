import { describe, expect, it } from 'vitest';
import { LATENT_KIND, LATENT_NAMES } from '../../src/collect/dataset.js';
import { PROBE_TARGETS, probeTarget } from '../../src/probe/targets.js';
import { fixtureDataset } from './fixture.js';

const { data } = fixtureDataset(200, 21);

describe('probe targets', () => {
  it('cover every latent with the read-out of its LATENT_KIND', () => {
    for (const name of LATENT_NAMES) expect(PROBE_TARGETS[name].kind).toBe(LATENT_KIND[name]);
  });

  it('read azimuth as [sin, cos] so that −180° and 180° are the same label (unit-circle identities)', () => {
    const latents = { ...data.latents, nearest_azimuth_deg: Float32Array.of(90, -180, 180, 0) };
    const labels = PROBE_TARGETS.nearest_azimuth_deg.labels({ ...data, latents }, [0, 1, 2, 3]);
    if (labels.kind !== 'continuous') throw new Error('azimuth must be continuous');
    expect(labels.outputs).toBe(2);
    const expected = [1, 0, 0, -1, 0, -1, 0, 1];
    labels.values.forEach((v, i) => expect(v).toBeCloseTo(expected[i], 6));
  });

  it('refuse a NaN latent or a negative class, naming the target and the step', () => {
    const latents = { ...data.latents, nearest_distance_m: Float32Array.of(1.5, NaN, 2.5), heading: Float32Array.of(0, 3, -1) };
    expect(PROBE_TARGETS.nearest_distance_m.labels({ ...data, latents }, [2, 0]).kind).toBe('continuous');
    expect(() => PROBE_TARGETS.nearest_distance_m.labels({ ...data, latents }, [2, 1])).toThrow("probe target 'nearest_distance_m' has no value at step 1 (NaN)");
    expect(() => PROBE_TARGETS.heading.labels({ ...data, latents }, [0, 1, 2])).toThrow("probe target 'heading' has no value at step 2 (-1)");
  });

  it('read class labels in the order of the given rows', () => {
    const latents = { ...data.latents, heading: Float32Array.of(0, 3, 2, 1) };
    const labels = PROBE_TARGETS.heading.labels({ ...data, latents }, [3, 1, 2]);
    expect(labels.kind === 'categorical' && Array.from(labels.classes)).toEqual([1, 3, 2]);
  });

  it('count classes from the class names, and at least two for a boolean', () => {
    const heading = PROBE_TARGETS.heading.labels(data, [0, 1, 2]);
    const moved = PROBE_TARGETS.moved.labels({ ...data, latents: { ...data.latents, moved: new Float32Array(200) } }, [0, 1]);
    expect(heading.kind === 'categorical' && heading.classCount).toBe(4);
    expect(moved.kind === 'categorical' && moved.classCount).toBe(2);
  });

  it('name an unknown target and list the valid ones', () => {
    expect(() => probeTarget('speed')).toThrow(`probe target 'speed' is unknown; expected one of ${LATENT_NAMES.join(', ')}`);
  });
});
