import { describe, expect, it } from 'vitest';
import { placeBlocks } from '../../src/tui/explore/layout.js';

const area = { columns: 80, height: 22, minMapColumns: 20, wantedMapColumns: 62 };

describe('placeBlocks', () => {
  it('stacks blocks in the first column with room and opens a new column for the rest', () => {
    // 6 + 9 rows share the first column; 17 more would make 32 > 22, so the second opens.
    const placed = placeBlocks([{ id: 'a', width: 20, height: 6 }, { id: 'b', width: 24, height: 9 }, { id: 'c', width: 26, height: 17 }], area);
    expect(placed.columns).toEqual([{ width: 24, height: 15, ids: ['a', 'b'] }, { width: 26, height: 17, ids: ['c'] }]);
    // 80 − (24 + 2) − (26 + 2) = 26 columns for the map.
    expect(placed.mapColumns).toBe(26);
    expect(placed.hidden).toEqual([]);
  });

  it('hides a block that would leave the map fewer columns than its minimum', () => {
    const blocks = [{ id: 'a', width: 26, height: 20 }, { id: 'b', width: 26, height: 20 }, { id: 'c', width: 24, height: 20 }];
    // Two columns leave 80 − 56 = 24 ≥ 20; a third would leave 24 − 26 < 20.
    expect(placeBlocks(blocks, area).hidden).toEqual(['c']);
  });

  it('hides a block taller than the area, and a block that continues a hidden one', () => {
    const placed = placeBlocks([{ id: 'tall', width: 10, height: 23 }, { id: 'more', width: 10, height: 5, follows: 'tall' }], area);
    expect(placed.hidden).toEqual(['tall', 'more']);
  });

  it('puts a continuing block only right of the block it continues', () => {
    const placed = placeBlocks([
      { id: 'a', width: 10, height: 5 }, { id: 'b', width: 10, height: 20 }, { id: 'b2', width: 10, height: 5, follows: 'b' },
    ], { ...area, columns: 120 });
    expect(placed.columns.map((c) => c.ids)).toEqual([['a'], ['b'], ['b2']]);
  });

  it('gives the map no more than it wants', () => {
    expect(placeBlocks([], { ...area, wantedMapColumns: 44 }).mapColumns).toBe(44);
  });
});
