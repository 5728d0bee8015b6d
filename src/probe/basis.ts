import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { LinearModel } from './ridge.js';

/**
 * The coordinates every read-out works in: features standardised with the training
 * rows' mean and std, then rotated onto the eigenvectors of their covariance.
 *
 * In this basis the training Gram matrix ZᵀZ/n is diagonal (the eigenvalues), so ridge
 * regression has a closed form for every penalty at once (Hastie, Tibshirani &
 * Friedman 2009, ESL §3.4.1, eq. 3.47) and the logistic read-out gets an exact diagonal
 * curvature bound. A rotation leaves the L2 penalty ‖w‖² unchanged, so the fitted
 * read-out is the one of the standardised features.
 */
export interface FeatureBasis {
  readonly d: number;
  readonly mean: Float64Array; // [d]
  /** 1/std per feature; 0 for a feature constant on the training rows (it carries nothing). */
  readonly scale: Float64Array; // [d]
  /** Eigenvectors as columns, row-major. */
  readonly rotation: Float64Array; // [d, d]
  /** Eigenvalues of ZᵀZ/n; those below 1e-10 of the largest are set to exactly 0 (null space). */
  readonly eigen: Float64Array; // [d]
}

/** The standardise-and-rotate basis fitted on n training rows of d features. */
export function featureBasis(features: Float32Array, n: number, d: number): FeatureBasis {
  if (n < 1 || features.length !== n * d) throw new Error(`featureBasis: expected ${n}×${d} features, got ${features.length} values`);
  const mean = new Float64Array(d);
  const scale = new Float64Array(d);
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) mean[j] += features[i * d + j];
  for (let j = 0; j < d; j++) mean[j] /= n;
  // Σ((x − μ)²/n) here, not stats/columns.ts's (Σ(x − μ)²)/n: the two differ in the last
  // bits, and switching would move every stored R² in its last digits.
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) scale[j] += (features[i * d + j] - mean[j]) ** 2 / n;
  }
  // A spread below a millionth of the mean is float32 rounding, not signal: a constant feature.
  for (let j = 0; j < d; j++) {
    const std = Math.sqrt(scale[j]);
    scale[j] = std > 1e-6 * Math.abs(mean[j]) && std > 0 ? 1 / std : 0;
  }
  const gram = standardisedGram(features, n, d, mean, scale);
  const evd = new EigenvalueDecomposition(gram, { assumeSymmetric: true });
  const vectors = evd.eigenvectorMatrix;
  const rotation = new Float64Array(d * d);
  for (let j = 0; j < d; j++) for (let k = 0; k < d; k++) rotation[j * d + k] = vectors.get(j, k);
  const values = evd.realEigenvalues;
  const largest = Math.max(0, ...values);
  const eigen = Float64Array.from(values, (v) => (v > 1e-10 * largest ? v : 0));
  return { d, mean, scale, rotation, eigen };
}

/** ZᵀZ/n of the standardised features, accumulated in float64. */
function standardisedGram(features: Float32Array, n: number, d: number, mean: Float64Array, scale: Float64Array): Matrix {
  const gram = new Float64Array(d * d);
  const row = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) row[j] = (features[i * d + j] - mean[j]) * scale[j];
    for (let j = 0; j < d; j++) {
      const a = row[j] / n;
      if (a === 0) continue;
      for (let k = j; k < d; k++) gram[j * d + k] += a * row[k];
    }
  }
  const out = new Matrix(d, d);
  for (let j = 0; j < d; j++) {
    for (let k = j; k < d; k++) {
      out.set(j, k, gram[j * d + k]);
      out.set(k, j, gram[j * d + k]);
    }
  }
  return out;
}

/** Rows of features expressed in the basis: ((x − mean)·scale)·rotation. */
export function toBasis(basis: FeatureBasis, features: Float32Array, n: number): Float64Array {
  const { d, mean, scale, rotation } = basis;
  if (features.length !== n * d) throw new Error(`toBasis: expected ${n}×${d} features, got ${features.length} values`);
  const z = new Float64Array(n * d); // [n, d]
  const row = new Float64Array(d);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) row[j] = (features[i * d + j] - mean[j]) * scale[j];
    const out = i * d;
    for (let j = 0; j < d; j++) {
      const a = row[j];
      if (a === 0) continue;
      const r = j * d;
      for (let k = 0; k < d; k++) z[out + k] += a * rotation[r + k];
    }
  }
  return z;
}

/**
 * The same linear function of raw features written in another basis: with v = diag(s)·R·W
 * the raw weights, z·W + b = x·v + b − μ·v, and z'·W' + b' equals it for W' = R'ᵀ·diag(1/s')·v,
 * b' = b − μ·v + μ'·v (R' is orthogonal). A feature constant in `to` gets no weight.
 */
export function changeBasis(model: LinearModel, from: FeatureBasis, to: FeatureBasis): LinearModel {
  const { d, k } = model;
  if (from.d !== d || to.d !== d) throw new Error(`changeBasis: a ${d}-feature model needs ${d}-feature bases, got ${from.d} and ${to.d}`);
  const raw = new Float64Array(d * k); // [d, k], v / s' once finished
  const intercept = Float64Array.from(model.intercept);
  for (let j = 0; j < d; j++) {
    for (let m = 0; m < d; m++) {
      const a = from.scale[j] * from.rotation[j * d + m];
      if (a !== 0) for (let c = 0; c < k; c++) raw[j * k + c] += a * model.weights[m * k + c];
    }
    for (let c = 0; c < k; c++) {
      intercept[c] += (to.mean[j] - from.mean[j]) * raw[j * k + c];
      raw[j * k + c] = to.scale[j] > 0 ? raw[j * k + c] / to.scale[j] : 0;
    }
  }
  const weights = new Float64Array(d * k);
  for (let j = 0; j < d; j++) {
    for (let m = 0; m < d; m++) {
      const r = to.rotation[j * d + m];
      for (let c = 0; c < k; c++) weights[m * k + c] += r * raw[j * k + c];
    }
  }
  return { d, k, weights, intercept };
}
