import { describe, expect, it } from 'vitest';
import { forEachCellBetween, solidCellsBetween } from '../../src/world/line.js';

function between(x0: number, y0: number, x1: number, y1: number): [number, number][] {
  const cells: [number, number][] = [];
  forEachCellBetween(x0, y0, x1, y1, (x, y) => { cells.push([x, y]); return true; });
  return cells;
}

// Bresenham (1965): the digital line from (0,0) to (6,2) steps y at the midpoints, worked by hand:
// error starts at dx - dy = 4 and the y step happens where the ideal line crosses y + 0.5.
describe('forEachCellBetween (Bresenham 1965)', () => {
  it('lists the cells strictly between the ends of a shallow line', () => {
    expect(between(0, 0, 6, 2)).toEqual([[1, 0], [2, 1], [3, 1], [4, 1], [5, 2]]);
  });

  it('lists the cells of a straight and of a diagonal line', () => {
    expect(between(0, 0, 0, 3)).toEqual([[0, 1], [0, 2]]);
    expect(between(3, 3, 0, 0)).toEqual([[2, 2], [1, 1]]);
  });

  it('has no cells between neighbours or a cell and itself', () => {
    expect(between(2, 2, 3, 2)).toEqual([]);
    expect(between(2, 2, 2, 2)).toEqual([]);
  });
});

describe('solidCellsBetween', () => {
  it('counts solid cells strictly between, not at the ends', () => {
    // row: S # # . S  (S = ends, themselves solid)
    const solid = Uint8Array.from([1, 1, 1, 0, 1]);
    expect(solidCellsBetween(solid, 5, 0, 0, 4, 0)).toBe(2);
  });
});
