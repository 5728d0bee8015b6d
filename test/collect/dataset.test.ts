import { describe, expect, it } from 'vitest';
import { classCount, LATENT_NAMES, type Dataset, type LatentName } from '../../src/collect/dataset.js';

/** A three-step dataset whose only content is the given latent values and class names. */
function withLatents(values: Partial<Record<LatentName, number[]>>, classNames: Dataset['classNames']): Dataset {
  const latents = Object.fromEntries(LATENT_NAMES.map((n) => [n, Float32Array.from(values[n] ?? [0, 0, 0])])) as Record<LatentName, Float32Array>;
  const empty = new Float32Array(0);
  return {
    steps: 3,
    channelSize: { sight: 0, sound: 0, touch: 0, motor: 0 },
    channels: { sight: empty, sound: empty, touch: empty, motor: empty },
    latents,
    episode: new Int32Array(3),
    hasNext: Uint8Array.of(1, 1, 0),
    classNames,
  };
}

describe('classCount', () => {
  it('is the number of class names when every index present is named', () => {
    const data = withLatents({ heading: [0, 3, 1] }, { heading: ['north', 'east', 'south', 'west'] });
    expect(classCount(data, 'heading')).toBe(4);
  });

  it('is 2 for a latent with a single named class (a world with one emitter)', () => {
    const data = withLatents({ nearest_emitter: [0, 0, 0] }, { nearest_emitter: ['kettle'] });
    expect(classCount(data, 'nearest_emitter')).toBe(2);
  });

  it('grows to the largest index present + 1 when names are missing; negative entries mean undefined', () => {
    const data = withLatents({ material_under: [4, -1, 2] }, {});
    expect(classCount(data, 'material_under')).toBe(5);
  });

  it('refuses a continuous latent, naming it', () => {
    expect(() => classCount(withLatents({}, {}), 'x')).toThrow("latent 'x' is continuous; it has no classes");
  });
});
