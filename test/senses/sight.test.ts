import { describe, expect, it } from 'vitest';
import { senseAll } from '../../src/senses/sense-all.js';
import type { Heading, World } from '../../src/world/types.js';
import { tinyWorld } from '../world/fixtures.js';

const WIDTH = 5;
const DEPTH = 4;

/** Which sight-field cells are lit (1) or dark (0), one string per row, nearest row first. */
function litMask(world: World, x: number, y: number, heading: Heading): string[] {
  const pose = { x, y, heading };
  const sight = senseAll(world, pose, { pose, moved: false, bumped: false }, 'stay', 0).sight;
  const rows: string[] = [];
  for (let d = 0; d < DEPTH; d++) {
    let row = '';
    for (let w = 0; w < WIDTH; w++) row += sight[(d * WIDTH + w) * 3] > 0 ? '1' : '0';
    rows.push(row);
  }
  return rows;
}

describe('sight line-of-sight occlusion on hand-drawn maps (Bresenham 1965 lines)', () => {
  it('sees a wall but not what lies behind it', () => {
    // The agent at (3,5) faces north at a wall segment two cells ahead. Lines from (3,5) to
    // every cell of row y=2 cross the segment (worked by hand on the Bresenham lines, e.g.
    // to (1,2): (2,4) then (2,3) which is wall), so rows 2 and 3 of the field are dark.
    const world = tinyWorld([
      '#######',
      '#E....#',
      '#.....#',
      '#.###.#',
      '#.....#',
      '#.....#',
      '#######',
    ]);
    expect(litMask(world, 3, 5, 'north')).toEqual(['11111', '11111', '00000', '00000']);
  });

  it('casts the shadow of a single pillar straight back, leaving the diagonals lit', () => {
    // Facing east from (1,3) with a pillar at (3,3): the centre column behind it is dark.
    const world = tinyWorld([
      '#######',
      '#.....#',
      '#.....#',
      '#..#..#',
      '#.....#',
      '#....E#',
      '#######',
    ]);
    expect(litMask(world, 1, 3, 'east')).toEqual(['11111', '11111', '11011', '11011']);
  });

  it('is dark off the map and behind the border', () => {
    // Facing west from (1,2) next to the border: row 0 is the border column x=0. Its outer cells
    // (0,4) and (0,0) are hidden by the border cells (0,3) and (0,1) on their lines; the rows
    // beyond are off the map.
    const world = tinyWorld(['#####', '#...#', '#...#', '#..E#', '#####']);
    expect(litMask(world, 1, 2, 'west')).toEqual(['01110', '00000', '00000', '00000']);
  });
});

describe('a floor-level (non-solid) emitter', () => {
  it('is seen in its own colour and does not hide what lies behind it', () => {
    // The hum `o` (blue, not solid) stands 1 cell ahead of (2,4) facing north; the floor behind stays lit.
    const world = tinyWorld(['#####', '#...#', '#...#', '#.o.#', '#...#', '#####']);
    const pose = { x: 2, y: 4, heading: 'north' as const };
    const sight = senseAll(world, pose, { pose, moved: false, bumped: false }, 'stay', 0).sight;
    expect([...sight.subarray(6, 9)]).toEqual([0, 0, 1]);
    expect(sight[(1 * WIDTH + 2) * 3 + 1]).toBeCloseTo(0.4 / 4, 6);
  });
});

describe('sight values', () => {
  const world = tinyWorld(['#####', '#..E#', '#...#', '#...#', '#...#', '#...#', '#####']);
  const pose = { x: 2, y: 5, heading: 'north' as const };
  const sight = senseAll(world, pose, { pose, moved: false, bumped: false }, 'stay', 0).sight;

  it('has shape [depth, width, 3] = 60 numbers by default', () => {
    expect(sight).toHaveLength(DEPTH * WIDTH * 3);
  });

  it('is colour × 1/r² (inverse-square law for a lamp at the agent): floor [0.2, 0.4, 0.6] one cell ahead', () => {
    expect([...sight.subarray(6, 9)].map((v) => +v.toFixed(6))).toEqual([0.2, 0.4, 0.6]);
  });

  it('dims the floor two rows ahead and one to the right by 1/(2² + 1²) = 1/5', () => {
    const k = 1 * WIDTH + 3;
    expect(sight[3 * k + 1]).toBeCloseTo(0.4 / 5, 6);
  });

  it('puts column 0 on the agent\'s left: facing north, the left column is the west wall', () => {
    // Row 0, column 0 is (0,4): a wall, colour 0.5, at r² = 1 + 4.
    expect(sight[0]).toBeCloseTo(0.5 / 5, 6);
    expect(sight[3]).toBeCloseTo(0.2 / 2, 6); // column 1 is the floor at (1,4), r² = 2
  });
});
