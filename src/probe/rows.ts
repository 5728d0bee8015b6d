/** The given rows of a row-major [n, width] array, in the given order. */
export function takeRows<T extends Float32Array | Float64Array>(values: T, width: number, rows: ArrayLike<number>): T {
  const out = new (values.constructor as new (length: number) => T)(rows.length * width);
  // A plain loop: a subarray per row costs more than copying a narrow row.
  for (let i = 0; i < rows.length; i++) {
    const from = rows[i] * width;
    for (let j = 0; j < width; j++) out[i * width + j] = values[from + j];
  }
  return out;
}
