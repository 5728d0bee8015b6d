import { describe, expect, it } from 'vitest';
import { seek, uniform, wander } from '../../src/collect/policies.js';
import { createRng } from '../../src/random.js';
import { ACTIONS, type Action } from '../../src/world/types.js';

const pose = { x: 1, y: 1, heading: 'north' as const };
const calm = { pose, moved: true, bumped: false };

function observation(leftDb: number, rightDb: number, front = 0) {
  return {
    transition: calm,
    sound: Float32Array.from([...new Array(16).fill(leftDb), ...new Array(16).fill(rightDb)]),
    touch: Float32Array.from([0, front, 0, 0, 0, 0, 0, 0]),
  };
}

function counts(draw: () => Action, n: number): Record<Action, number> {
  const c = Object.fromEntries(ACTIONS.map((a) => [a, 0])) as Record<Action, number>;
  for (let i = 0; i < n; i++) c[draw()]++;
  return c;
}

describe('wander', () => {
  it('always turns when the front whisker touches a wall', () => {
    const rng = createRng(1, 'test');
    const c = counts(() => wander.act(observation(30, 30, 1), rng), 1000);
    expect(c['turn-left'] + c['turn-right']).toBe(1000);
  });

  it('mostly goes forward in the open (0.8 by design; N = 4000, 5 standard errors = 0.032)', () => {
    const rng = createRng(2, 'test');
    const c = counts(() => wander.act(observation(30, 30), rng), 4000);
    expect(Math.abs(c.forward / 4000 - 0.8)).toBeLessThan(0.032);
  });
});

describe('uniform', () => {
  it('draws each action with probability 1/5 (N = 10000, 5 standard errors = 0.02)', () => {
    const rng = createRng(3, 'test');
    const c = counts(() => uniform.act(observation(30, 30), rng), 10000);
    for (const a of ACTIONS) expect(Math.abs(c[a] / 10000 - 0.2)).toBeLessThan(0.02);
  });
});

describe('seek', () => {
  it('turns towards the louder ear and goes forward when the ears agree', () => {
    const rng = createRng(4, 'test');
    const right = counts(() => seek.act(observation(30, 40), rng), 2000);
    const left = counts(() => seek.act(observation(40, 30), rng), 2000);
    const ahead = counts(() => seek.act(observation(35, 35), rng), 2000);
    expect(right['turn-right']).toBeGreaterThan(1700);
    expect(left['turn-left']).toBeGreaterThan(1700);
    expect(ahead.forward).toBeGreaterThan(1700);
  });
});
