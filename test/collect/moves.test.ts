import { describe, expect, it } from 'vitest';
import { MoveTable } from '../../src/collect/moves.js';
import { step } from '../../src/world/movement.js';
import { ACTIONS, HEADINGS } from '../../src/world/types.js';
import { tinyWorld } from '../world/fixtures.js';

// The table must only remember what world/movement.ts's `step` (the movement rule) returns.
const world = tinyWorld(['#####', '#..E#', '#.#.#', '#####']);

describe('MoveTable', () => {
  it('gives the transition `step` gives, for every free pose and action, asked twice', () => {
    const moves = new MoveTable(world);
    for (let round = 0; round < 2; round++) {
      for (let cell = 0; cell < world.width * world.height; cell++) {
        if (world.solid[cell] === 1) continue;
        for (const heading of HEADINGS) {
          const pose = { x: cell % world.width, y: Math.floor(cell / world.width), heading };
          for (const action of ACTIONS) {
            expect(moves.transition(moves.take(moves.rest(pose), action))).toEqual(step(world, pose, action));
          }
        }
      }
    }
  });

  it('returns the same transition object for the same pose and outcome, so a walk allocates none', () => {
    const moves = new MoveTable(world);
    const start = moves.rest({ x: 1, y: 1, heading: 'east' });
    const there = moves.take(start, 'forward');
    const back = moves.take(moves.take(there, 'back'), 'forward');
    expect(moves.transition(back)).toBe(moves.transition(there));
  });
});
