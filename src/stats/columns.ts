/**
 * What a column with no usable spread gets as its standard deviation. Callers differ
 * for good reasons, so each names its rule:
 * - `keep`: the computed std, 0 included (for callers that multiply by it, never divide);
 * - `unit-below`: std 1 when std < `tolerance`, so dividing by it only centres the column;
 * - `zero-relative`: std 0 when std ≤ `tolerance`·|mean|, a spread that is float32
 *   rounding of the mean rather than signal, so the column carries nothing.
 */
export type ConstantColumnRule =
  | { readonly kind: 'keep' }
  | { readonly kind: 'unit-below'; readonly tolerance: number }
  | { readonly kind: 'zero-relative'; readonly tolerance: number };

/** Per-column mean and population standard deviation (divisor n). */
export interface ColumnStatistics {
  readonly mean: Float64Array; // [cols]
  readonly std: Float64Array; // [cols]
}

/**
 * Mean and population std of each column of a row-major [n, cols] array, over the given
 * rows (all rows when none are given), with constant columns treated by `rule`. With
 * `weights`, the r-th picked row counts weights[r] times (a row standing for its repeats),
 * and the divisor is Σ weights.
 *
 * Two passes in float64: the mean, then the squared deviations around it. The one-pass
 * Σx² − n·x̄² cancels catastrophically for large means such as dB levels near 60 (Chan,
 * Golub & LeVeque 1983, "Algorithms for computing the sample variance", §2). With no rows
 * the mean and the computed std are 0.
 */
export function columnStatistics(
  values: ArrayLike<number>, // [n, cols]
  cols: number,
  rule: ConstantColumnRule,
  rows?: ArrayLike<number>,
  weights?: ArrayLike<number>,
): ColumnStatistics {
  if (!Number.isInteger(cols) || cols < 0 || (cols === 0 ? values.length !== 0 : values.length % cols !== 0)) {
    throw new Error(`columnStatistics: ${values.length} values are not rows of ${cols} columns`);
  }
  if (cols === 0) return { mean: new Float64Array(0), std: new Float64Array(0) };
  const n = values.length / cols;
  const picked = rows ?? { length: n };
  if (weights != null && weights.length !== picked.length) throw new Error(`columnStatistics: ${weights.length} weights for ${picked.length} rows`);
  const weightOf = (r: number): number => (weights == null ? 1 : weights[r]);
  let count = 0;
  for (let r = 0; r < picked.length; r++) count += weightOf(r);
  const rowAt = (r: number): number => {
    const row = rows == null ? r : rows[r];
    if (rows != null && !(Number.isInteger(row) && row >= 0 && row < n)) throw new Error(`columnStatistics: row ${row} is outside 0..${n - 1}`);
    return row * cols;
  };
  const mean = new Float64Array(cols);
  for (let r = 0; r < picked.length; r++) {
    const at = rowAt(r);
    const w = weightOf(r);
    for (let c = 0; c < cols; c++) mean[c] += w * values[at + c];
  }
  for (let c = 0; c < cols; c++) mean[c] /= Math.max(count, 1);
  const sumSq = new Float64Array(cols);
  for (let r = 0; r < picked.length; r++) {
    const at = rowAt(r);
    const w = weightOf(r);
    for (let c = 0; c < cols; c++) {
      const d = values[at + c] - mean[c];
      sumSq[c] += w * d * d;
    }
  }
  const std = new Float64Array(cols);
  for (let c = 0; c < cols; c++) std[c] = constantColumnStd(Math.sqrt(sumSq[c] / Math.max(count, 1)), mean[c], rule);
  return { mean, std };
}

function constantColumnStd(std: number, mean: number, rule: ConstantColumnRule): number {
  switch (rule.kind) {
    case 'keep': return std;
    case 'unit-below': return std < rule.tolerance ? 1 : std;
    case 'zero-relative': return std > rule.tolerance * Math.abs(mean) && std > 0 ? std : 0;
  }
}
