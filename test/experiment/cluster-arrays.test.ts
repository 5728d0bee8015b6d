// Array task indices for Slurm. The --array forms ("0-15", "0,6,16-32", "%4") are those of
// the sbatch manual (SchedMD, sbatch(1)); the task index limit is MaxArraySize − 1, 1000
// by default (SchedMD, slurm.conf(5), MaxArraySize).
import { describe, expect, it } from 'vitest';
import { arrayBlocks, blockSize, compressIndices } from '../../src/experiment/cluster-arrays.js';
import { createRng } from '../../src/random.js';

describe('compressIndices', () => {
  it('writes runs as ranges and lone indices as themselves, in the form of sbatch --array=0,6,16-32', () => {
    expect(compressIndices([0, 6, ...Array.from({ length: 17 }, (_, i) => 16 + i)])).toBe('0,6,16-32');
    expect(compressIndices([3, 17, 40, 41, 42, 43, 44, 45, 46, 47, 48, 49, 50, 51, 52])).toBe('3,17,40-52');
  });

  it('writes two neighbours as a range, one index alone, and nothing for no index', () => {
    expect(compressIndices([4, 5])).toBe('4-5');
    expect(compressIndices([9])).toBe('9');
    expect(compressIndices([])).toBe('');
  });
});

describe('blockSize', () => {
  it('is the largest power of ten not above MaxArraySize: 1000 for the default 1001', () => {
    expect([1001, 1000, 999, 10, 9, 1, 4_000_001].map(blockSize)).toEqual([1000, 1000, 100, 10, 1, 1, 1_000_000]);
  });

  it('refuses a size below 1', () => {
    expect(() => blockSize(0)).toThrow('maxArraySize: expected a whole number ≥ 1, got 0');
  });
});

describe('arrayBlocks', () => {
  it('cuts 2,000 cells into two arrays of tasks 0–999 under the default MaxArraySize of 1001', () => {
    const blocks = arrayBlocks(Array.from({ length: 2000 }, (_, i) => i), 1001);
    expect(blocks.map((b) => [b.offset, b.tasks.length, b.tasks[0], b.tasks.at(-1)])).toEqual([[0, 1000, 0, 999], [1000, 1000, 0, 999]]);
  });

  it('keeps only the blocks that hold a cell: cells 3, 999, 1000 and 2999 give three arrays', () => {
    expect(arrayBlocks([3, 999, 1000, 2999], 1001)).toEqual([
      { offset: 0, tasks: [3, 999] },
      { offset: 1000, tasks: [0] },
      { offset: 2000, tasks: [999] },
    ]);
  });

  it('covers exactly the given cells with every task index below the limit (200 random sets, common practice)', () => {
    const rng = createRng(13, 'cluster-arrays');
    for (let trial = 0; trial < 200; trial++) {
      const limit = 1 + Math.floor(rng() * 3000);
      const cells = Array.from({ length: 5000 }, (_, i) => i).filter(() => rng() < 0.1);
      const blocks = arrayBlocks(cells, limit);
      expect(blocks.flatMap((b) => b.tasks.map((t) => b.offset + t))).toEqual(cells);
      expect(blocks.every((b) => b.tasks.every((t) => t < limit))).toBe(true);
    }
  });

  it('refuses cells out of order or repeated', () => {
    expect(() => arrayBlocks([3, 2], 1001)).toThrow('cells: expected ascending distinct indices ≥ 0, got 3,2');
    expect(() => arrayBlocks([2, 2], 1001)).toThrow('got 2,2');
  });
});
