import { describe, expect, it } from 'vitest';
import { LATENT_NAMES } from '../../src/collect/dataset.js';
import { latentsAt, POSE_LATENTS } from '../../src/collect/latents.js';
import type { Heading } from '../../src/world/types.js';
import { tinyWorld } from '../world/fixtures.js';

// Latent definitions from DESIGN "The world": azimuth 0 straight ahead, positive to the right.
const world = tinyWorld(['#######', '#.....#', '#.....#', '#..E..#', '#.....#', '#..,..#', '#######']);
const at = (x: number, y: number, heading: Heading) => {
  const pose = { x, y, heading };
  return latentsAt(world, pose, { pose, moved: false, bumped: false });
};

describe('latentsAt', () => {
  it('puts a source straight ahead at 0°, to the right at +90°, to the left at −90°, behind at 180°', () => {
    expect(at(3, 5, 'north').nearest_azimuth_deg).toBeCloseTo(0, 9);
    expect(at(3, 5, 'west').nearest_azimuth_deg).toBeCloseTo(90, 9);
    expect(at(3, 5, 'east').nearest_azimuth_deg).toBeCloseTo(-90, 9);
    expect(at(3, 5, 'south').nearest_azimuth_deg).toBe(180);
  });

  it('measures the nearest distance in metres between cell centres (cell 1 m)', () => {
    expect(at(1, 1, 'north').nearest_distance_m).toBeCloseTo(Math.hypot(2, 2), 9);
  });

  it('records underfoot and ahead materials, and wall ahead', () => {
    const facingWall = at(3, 5, 'south');
    expect(facingWall.material_under).toBe(2); // rug
    expect(facingWall.material_ahead).toBe(0); // wall
    expect(facingWall.wall_ahead).toBe(1);
    expect(at(3, 5, 'north').wall_ahead).toBe(0);
  });

  it('sees the emitter when it is in the sight field and not when facing away', () => {
    expect(at(3, 5, 'north').emitter_in_view).toBe(1);
    expect(at(3, 5, 'south').emitter_in_view).toBe(0);
  });
});

describe('latent layout', () => {
  it('ends with moved and bumped, the two latents that depend on the step rather than the pose', () => {
    // The collector keeps the first POSE_LATENTS per pose and writes these two every step.
    expect(LATENT_NAMES.slice(POSE_LATENTS)).toEqual(['moved', 'bumped']);
  });
});
