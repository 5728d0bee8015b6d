import { describe, expect, it } from 'vitest';
import { initialExploreState, reduceExplore, type ExploreState } from '../../src/tui/explore/explore-state.js';
import { stepsToNextSwitch } from '../../src/world/emitter.js';
import { BELL_AHEAD, bellRoom, plainRoom } from './worlds.js';

const start = (): ExploreState => initialExploreState([bellRoom(BELL_AHEAD), plainRoom()], 7, true);
const press = (state: ExploreState, ...keys: string[]) => keys.reduce(reduceExplore, state);

describe('explore reducer: moving', () => {
  it('starts at the world\'s start pose with the clock at 0', () => {
    const s = start();
    expect([s.pose, s.stepIndex, s.action]).toEqual([{ x: 2, y: 3, heading: 'north' }, 0, 'stay']);
  });

  it('moves forward with the up arrow and with w, one cell along the heading (north is y − 1)', () => {
    expect(press(start(), 'up').pose).toEqual({ x: 2, y: 2, heading: 'north' });
    expect(press(start(), 'w').pose).toEqual({ x: 2, y: 2, heading: 'north' });
  });

  it('turns a quarter turn with left/a and right/d, and backs up with down/s', () => {
    expect(press(start(), 'left').pose.heading).toBe('west');
    expect(press(start(), 'a', 'a').pose.heading).toBe('south');
    expect(press(start(), 'right').pose.heading).toBe('east');
    expect(press(start(), 'd', 'w').pose).toEqual({ x: 3, y: 3, heading: 'east' });
    expect(press(start(), 'w', 'down').pose).toEqual({ x: 2, y: 3, heading: 'north' });
    expect(press(start(), 'w', 's').transition.moved).toBe(true);
  });

  it('records a bump and stays put when walking into the wall', () => {
    const s = press(start(), 's');
    expect([s.pose, s.transition.bumped, s.transition.moved, s.action]).toEqual([{ x: 2, y: 3, heading: 'north' }, true, false, 'back']);
  });

  it('advances the clock by one per action, including stay (space or .)', () => {
    const s = press(start(), 'w', 'a', ' ', '.');
    expect([s.stepIndex, s.action, s.pose]).toEqual([4, 'stay', { x: 2, y: 2, heading: 'west' }]);
  });
});

describe('explore reducer: clock', () => {
  it('jumps to the next step where an emitter switches (period 4, duty 0.25: on at 0, off 1..3)', () => {
    const world = bellRoom(BELL_AHEAD);
    expect(stepsToNextSwitch(world, 0)).toBe(1);
    expect(stepsToNextSwitch(world, 1)).toBe(3);
    const s = press(start(), 't', 't');
    expect([s.stepIndex, s.action, s.pose]).toEqual([4, 'stay', { x: 2, y: 3, heading: 'north' }]);
  });

  it('ticks one step when no emitter cycles', () => {
    expect(stepsToNextSwitch(plainRoom(), 10)).toBe(1);
  });
});

describe('explore reducer: noise', () => {
  it('cycles the edited channel through sight, sound, touch, motor with n', () => {
    const channels = [1, 2, 3, 4].map((n) => press(start(), ...Array<string>(n).fill('n')).noiseChannel);
    expect(channels).toEqual(['sound', 'touch', 'motor', 'sight']);
  });

  it('cycles kinds with k, offering masking for sound only', () => {
    const sight = [1, 2, 3].map((n) => press(start(), ...Array<string>(n).fill('k')).noise.sight.kind);
    expect(sight).toEqual(['dropout', 'blackout', 'gaussian']);
    const sound = [1, 2, 3, 4].map((n) => press(start(), 'n', ...Array<string>(n).fill('k')).noise.sound.kind);
    expect(sound).toEqual(['dropout', 'blackout', 'masking', 'gaussian']);
  });

  it('raises severity with + or = up to 5 and lowers it with - down to 0, on the edited channel only', () => {
    const up = press(start(), 'n', '+', '=', '+', '+', '+', '+', '+');
    expect([up.noise.sound.severity, up.noise.sight.severity]).toEqual([5, 0]);
    expect(press(up, '-', '-').noise.sound.severity).toBe(3);
    expect(press(start(), '-').noise.sight.severity).toBe(0);
  });
});

describe('explore reducer: screen keys', () => {
  it('switches to the next world with g, at its start pose with the clock reset, and wraps around', () => {
    const s = press(start(), 'w', 'w', 'g');
    expect([s.worldIndex, s.pose, s.stepIndex]).toEqual([1, { x: 1, y: 1, heading: 'east' }, 0]);
    expect(press(s, 'g').worldIndex).toBe(0);
  });

  it('keeps the noise settings across worlds', () => {
    expect(press(start(), '+', 'g').noise.sight.severity).toBe(1);
  });

  it('toggles colour, ground truth and help, and sets quit with q', () => {
    const s = press(start(), 'c', 'l', '?');
    expect([s.colour, s.latents, s.help, s.quit]).toEqual([false, true, true, false]);
    expect(press(s, 'c', 'l', '?', 'q')).toMatchObject({ colour: true, latents: false, help: false, quit: true });
  });

  it('ignores keys it does not know', () => {
    const s = start();
    expect(reduceExplore(s, 'x')).toBe(s);
  });
});
