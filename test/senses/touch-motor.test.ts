import { describe, expect, it } from 'vitest';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { channelEntryNames, channelSize } from '../../src/senses/registry.js';
import { senseAll } from '../../src/senses/sense-all.js';
import type { Action, Pose, Transition } from '../../src/world/types.js';
import { tinyWorld } from '../world/fixtures.js';

// Touch and motor follow DESIGN "The senses": whiskers, bump force, footfall texture; one-hot action.
const world = tinyWorld(['#####', '#.,.#', '#..E#', '#####']);

function touch(pose: Pose, transition: Partial<Transition> = {}, action: Action = 'stay'): number[] {
  const t = { pose, moved: false, bumped: false, ...transition };
  return [...senseAll(world, pose, t, action, 0).touch].map((v) => +v.toFixed(6));
}

describe('touch', () => {
  it('names every entry', () => {
    expect(channelEntryNames('touch', DEFAULT_SENSE_SETTINGS)).toEqual([
      'whisker_left', 'whisker_front', 'whisker_right', 'bump_force', 'footfall_0', 'footfall_1', 'footfall_2', 'footfall_3',
    ]);
  });

  it('feels walls left and ahead in a corner facing north, nothing else when still', () => {
    expect(touch({ x: 1, y: 1, heading: 'north' })).toEqual([1, 1, 0, 0, 0, 0, 0, 0]);
  });

  it('feels a solid emitter with the right whisker', () => {
    expect(touch({ x: 2, y: 2, heading: 'north' }).slice(0, 3)).toEqual([0, 0, 1]);
  });

  it('feels the bump force only on a bump', () => {
    expect(touch({ x: 1, y: 1, heading: 'north' }, { bumped: true })[3]).toBe(1);
  });

  it('feels the texture of the material underfoot only after a move (rug at (2,1))', () => {
    expect(touch({ x: 2, y: 1, heading: 'east' }, { moved: true }).slice(4)).toEqual([0.9, 0, 0, 0]);
    expect(touch({ x: 2, y: 1, heading: 'east' }).slice(4)).toEqual([0, 0, 0, 0]);
  });
});

describe('motor', () => {
  it('is the one-hot efference copy of the action, in ACTIONS order', () => {
    const pose = { x: 1, y: 1, heading: 'east' as const };
    const motor = senseAll(world, pose, { pose, moved: false, bumped: false }, 'turn-left', 0).motor;
    expect([...motor]).toEqual([0, 0, 1, 0, 0]);
  });
});

describe('channel registry', () => {
  it('gives the default sizes: sight 4×5×3, sound 2×16, touch 8, motor 5', () => {
    expect(channelSize('sight', DEFAULT_SENSE_SETTINGS)).toBe(60);
    expect(channelSize('sound', DEFAULT_SENSE_SETTINGS)).toBe(32);
    expect(channelSize('touch', DEFAULT_SENSE_SETTINGS)).toBe(8);
    expect(channelSize('motor', DEFAULT_SENSE_SETTINGS)).toBe(5);
  });

  it('names every entry of every channel', () => {
    expect(channelEntryNames('sight', DEFAULT_SENSE_SETTINGS)[5]).toBe('d0_w1_b');
    expect(channelEntryNames('sound', DEFAULT_SENSE_SETTINGS)[16]).toBe('right_100hz');
    expect(channelEntryNames('motor', DEFAULT_SENSE_SETTINGS)).toEqual(['forward', 'back', 'turn-left', 'turn-right', 'stay']);
  });
});
