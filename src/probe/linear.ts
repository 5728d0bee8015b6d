/**
 * A fitted linear read-out, ŷ = z·W + b: regression outputs, or one score per class.
 * Its rows are basis coordinates, or raw features for a model moved onto them.
 */
export interface LinearModel {
  readonly d: number;
  readonly k: number;
  readonly weights: Float64Array; // [d, k]
  readonly intercept: Float64Array; // [k]
}

/** Predictions z·W + b for n rows (in the model's basis, or raw features for a model on them). */
export function predictLinear(model: LinearModel, z: Float32Array | Float64Array, n: number): Float64Array {
  const { d, k, weights, intercept } = model;
  const out = new Float64Array(n * k); // [n, k]
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < k; c++) out[i * k + c] = intercept[c];
    for (let j = 0; j < d; j++) {
      const a = z[i * d + j];
      if (a === 0) continue;
      for (let c = 0; c < k; c++) out[i * k + c] += a * weights[j * k + c];
    }
  }
  return out;
}
