import { describe, expect, it } from 'vitest';
import { emitterIsOn } from '../../src/world/emitter.js';
import { cellAhead, step } from '../../src/world/movement.js';
import { tinyWorld } from './fixtures.js';

// The movement rules are the world's contract (DESIGN "The world"), checked on a hand-drawn map.
const world = tinyWorld([
  '#####',
  '#..E#',
  '#.#.#',
  '#####',
]);

describe('step', () => {
  it('moves forward one cell along the heading', () => {
    expect(step(world, { x: 1, y: 1, heading: 'east' }, 'forward'))
      .toEqual({ pose: { x: 2, y: 1, heading: 'east' }, moved: true, bumped: false });
  });

  it('moves back one cell against the heading', () => {
    expect(step(world, { x: 1, y: 2, heading: 'south' }, 'back'))
      .toEqual({ pose: { x: 1, y: 1, heading: 'south' }, moved: true, bumped: false });
  });

  it('bumps without moving when the cell ahead is a wall', () => {
    expect(step(world, { x: 1, y: 1, heading: 'north' }, 'forward'))
      .toEqual({ pose: { x: 1, y: 1, heading: 'north' }, moved: false, bumped: true });
  });

  it('bumps on a solid emitter cell', () => {
    expect(step(world, { x: 2, y: 1, heading: 'east' }, 'forward').bumped).toBe(true);
  });

  it('bumps when backing into an interior wall', () => {
    expect(step(world, { x: 2, y: 1, heading: 'north' }, 'back').bumped).toBe(true);
  });

  it('turns a quarter turn in place: left from north is west, right from west is north', () => {
    expect(step(world, { x: 1, y: 1, heading: 'north' }, 'turn-left').pose.heading).toBe('west');
    expect(step(world, { x: 1, y: 1, heading: 'west' }, 'turn-right').pose.heading).toBe('north');
    expect(step(world, { x: 1, y: 1, heading: 'west' }, 'turn-right').moved).toBe(false);
  });

  it('stays put on stay', () => {
    expect(step(world, { x: 1, y: 1, heading: 'south' }, 'stay'))
      .toEqual({ pose: { x: 1, y: 1, heading: 'south' }, moved: false, bumped: false });
  });
});

describe('cellAhead', () => {
  it('is one cell along the heading: west of (3, 3) is (2, 3)', () => {
    expect(cellAhead({ x: 3, y: 3, heading: 'west' })).toEqual({ x: 2, y: 3 });
  });
});

describe('emitterIsOn', () => {
  const clock = { ...world.emitters[0], periodSteps: 4, duty: 0.25 };

  it('is always on with period 0', () => {
    expect([0, 1, 7, 1000].every((t) => emitterIsOn(world.emitters[0], t))).toBe(true);
  });

  it('is on for the first round(duty × period) steps of each period', () => {
    expect([0, 1, 2, 3, 4, 5].map((t) => emitterIsOn(clock, t))).toEqual([true, false, false, false, true, false]);
    const half = { ...clock, periodSteps: 6, duty: 0.5 };
    expect([0, 1, 2, 3, 4, 5, 6].map((t) => emitterIsOn(half, t))).toEqual([true, true, true, false, false, false, true]);
  });

  it('is never on with duty 0', () => {
    expect([0, 1, 2, 3].some((t) => emitterIsOn({ ...clock, duty: 0 }, t))).toBe(false);
  });
});
