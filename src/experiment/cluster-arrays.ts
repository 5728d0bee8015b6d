/**
 * Which array tasks run which cells. A scheduler refuses an array task index of its
 * MaxArraySize or more (Slurm's default is 1001, so indices 0–1000), so the cells are
 * cut into blocks of a power of ten cells each: block b holds cells b·size … (b+1)·size − 1
 * and is submitted as one array whose task i runs cell b·size + i. A power of ten keeps a
 * task's log name equal to its cell index (block prefix, then the zero-padded task id).
 */

/** One job array: its tasks run the cells `offset + task`. */
export interface ArrayBlock {
  /** The index of the cell that task 0 would run. */
  readonly offset: number;
  /** Array task ids, ascending. */
  readonly tasks: readonly number[];
}

/** The cells of one block: the largest power of ten that keeps every task index below `maxArraySize`. */
export function blockSize(maxArraySize: number): number {
  if (!Number.isInteger(maxArraySize) || maxArraySize < 1) throw new RangeError(`maxArraySize: expected a whole number ≥ 1, got ${maxArraySize}`);
  let size = 1;
  while (size * 10 <= maxArraySize) size *= 10;
  return size;
}

/** The job arrays that run exactly the given cells (ascending, distinct), one per block that holds any. */
export function arrayBlocks(cells: readonly number[], maxArraySize: number): ArrayBlock[] {
  const size = blockSize(maxArraySize);
  const blocks: { offset: number; tasks: number[] }[] = [];
  cells.forEach((cell, i) => {
    if (!Number.isInteger(cell) || cell < 0 || (i > 0 && cell <= cells[i - 1])) throw new RangeError(`cells: expected ascending distinct indices ≥ 0, got ${cells.join(',')}`);
    const offset = Math.floor(cell / size) * size;
    if (blocks.at(-1)?.offset !== offset) blocks.push({ offset, tasks: [] });
    (blocks.at(-1) as { tasks: number[] }).tasks.push(cell - offset);
  });
  return blocks;
}

/** Ascending distinct indices as a list of single values and ranges: `3,17,40-52`. */
export function compressIndices(indices: readonly number[]): string {
  const parts: string[] = [];
  let start = 0;
  for (let i = 1; i <= indices.length; i++) {
    if (i < indices.length && indices[i] === indices[i - 1] + 1) continue;
    parts.push(i - 1 === start ? String(indices[start]) : `${indices[start]}-${indices[i - 1]}`);
    start = i;
  }
  return parts.join(',');
}
