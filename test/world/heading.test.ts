import { describe, expect, it } from 'vitest';
import { HEADING_INDEX, headingFrame, leftOf, poseCount, poseIndex, rightOf } from '../../src/world/heading.js';
import { HEADINGS } from '../../src/world/types.js';

// The compass on a map drawn in rows: north is up the page, so y (the row) decreases going
// north and x (the column) increases going east (the world file's contract, worlds/README.md).
describe('heading geometry', () => {
  it('points north up the map (y decreasing) and east to the right (x increasing)', () => {
    expect(headingFrame('north')).toMatchObject({ fx: 0, fy: -1 });
    expect(headingFrame('east')).toMatchObject({ fx: 1, fy: 0 });
    expect(headingFrame('south')).toMatchObject({ fx: 0, fy: 1 });
    expect(headingFrame('west')).toMatchObject({ fx: -1, fy: 0 });
  });

  it("has each heading's right-hand vector equal to the forward vector of the heading a right turn gives", () => {
    for (const h of HEADINGS) {
      const { rx, ry } = headingFrame(h);
      const { fx, fy } = headingFrame(rightOf(h));
      expect([rx, ry]).toEqual([fx, fy]);
    }
  });

  it('turns a quarter turn: left from north is west, right from west is north, and the two undo each other', () => {
    expect(leftOf('north')).toBe('west');
    expect(rightOf('west')).toBe('north');
    for (const h of HEADINGS) {
      expect(leftOf(rightOf(h))).toBe(h);
      expect(rightOf(rightOf(rightOf(rightOf(h))))).toBe(h);
    }
  });

  it('indexes headings in HEADINGS order, north 0 to west 3', () => {
    expect(HEADINGS.map((h) => HEADING_INDEX[h])).toEqual([0, 1, 2, 3]);
    expect(HEADINGS).toEqual(['north', 'east', 'south', 'west']);
  });
});

describe('poseIndex', () => {
  it('numbers the four headings of a cell next to each other: (y · width + x) · 4 + heading', () => {
    // Width 7: cell (2, 3) is 3 · 7 + 2 = 23, so its headings are 92..95 (by hand).
    expect(HEADINGS.map((heading) => poseIndex(7, { x: 2, y: 3, heading }))).toEqual([92, 93, 94, 95]);
    expect(poseCount(7, 5)).toBe(140);
  });
});
