import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { columnStatistics } from '../stats/columns.js';
import type { LinearModel } from './linear.js';

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

/** Rows in basis coordinates, each distinct vector stored once. */
export interface BasisRows {
  readonly z: Float64Array; // [distinct, d]
  /** For each row, the row of z that holds its vector. */
  readonly index: Int32Array; // [n]
}

/**
 * The standardise-and-rotate basis fitted on the training rows, given as m distinct rows
 * of d features and how often each occurs (once each when `counts` is left out): every
 * statistic is that of the rows with repeats, n = Σ counts of them.
 */
export function featureBasis(features: Float32Array, m: number, d: number, counts?: Int32Array): FeatureBasis {
  if (m < 1 || features.length !== m * d) throw new Error(`featureBasis: expected ${m}×${d} features, got ${features.length} values`);
  if (counts !== undefined && counts.length !== m) throw new Error(`featureBasis: expected ${m} counts, got ${counts.length}`);
  const weights = counts ?? new Int32Array(m).fill(1);
  const { mean, scale } = columnMoments(features, m, d, weights);
  const gram = standardisedGram(features, m, d, weights, mean, scale);
  const evd = new EigenvalueDecomposition(gram, { assumeSymmetric: true });
  const vectors = evd.eigenvectorMatrix;
  const rotation = new Float64Array(d * d);
  for (let j = 0; j < d; j++) for (let k = 0; k < d; k++) rotation[j * d + k] = vectors.get(j, k);
  const values = evd.realEigenvalues;
  const largest = Math.max(0, ...values);
  const eigen = Float64Array.from(values, (v) => (v > 1e-10 * largest ? v : 0));
  return { d, mean, scale, rotation, eigen };
}

/**
 * Column mean and 1/std (population form) of weighted rows; scale 0 marks a constant
 * column, one whose spread is below a millionth of its mean (float32 rounding, not signal).
 */
function columnMoments(features: Float32Array, m: number, d: number, weights: Int32Array): { mean: Float64Array; scale: Float64Array } {
  const { mean, std } = columnStatistics(features, d, { kind: 'zero-relative', tolerance: 1e-6 }, undefined, weights);
  return { mean, scale: std.map((s) => (s > 0 ? 1 / s : 0)) };
}

/** ZᵀZ/n of the standardised features of weighted rows, accumulated in float64. */
function standardisedGram(features: Float32Array, m: number, d: number, weights: Int32Array, mean: Float64Array, scale: Float64Array): Matrix {
  let n = 0;
  for (const w of weights) n += w;
  const gram = new Float64Array(d * d);
  const row = new Float64Array(d);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < d; j++) row[j] = (features[i * d + j] - mean[j]) * scale[j];
    for (let j = 0; j < d; j++) {
      const a = (weights[i] * row[j]) / n;
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
 * The same linear function written on raw features: with v = diag(s)·R·W,
 * z·W + b = ((x − μ)·diag(s))·R·W + b = x·v + (b − μ·v), so test rows need no projection.
 */
export function onRawFeatures(model: LinearModel, basis: FeatureBasis): LinearModel {
  const { d, k } = model;
  if (basis.d !== d) throw new Error(`onRawFeatures: a ${d}-feature model needs a ${d}-feature basis, got ${basis.d}`);
  const weights = new Float64Array(d * k); // [d, k]
  const intercept = Float64Array.from(model.intercept);
  for (let j = 0; j < d; j++) {
    for (let m = 0; m < d; m++) {
      const a = basis.scale[j] * basis.rotation[j * d + m];
      if (a !== 0) for (let c = 0; c < k; c++) weights[j * k + c] += a * model.weights[m * k + c];
    }
    for (let c = 0; c < k; c++) intercept[c] -= basis.mean[j] * weights[j * k + c];
  }
  return { d, k, weights, intercept };
}

/**
 * The same linear function written in another basis: on raw features first (x·v + c),
 * then in `to`, where z'·W' + b' = x·v + c for W' = R'ᵀ·diag(1/s')·v and b' = c + μ'·v
 * (R' is orthogonal). A feature constant in `to` gets no weight.
 */
export function changeBasis(model: LinearModel, from: FeatureBasis, to: FeatureBasis): LinearModel {
  const { d, k } = model;
  if (to.d !== d) throw new Error(`changeBasis: a ${d}-feature model needs a ${d}-feature basis, got ${to.d}`);
  const raw = onRawFeatures(model, from);
  const weights = new Float64Array(d * k); // [d, k]
  const intercept = Float64Array.from(raw.intercept);
  for (let j = 0; j < d; j++) {
    for (let c = 0; c < k; c++) {
      const v = raw.weights[j * k + c];
      intercept[c] += to.mean[j] * v;
      const scaled = to.scale[j] > 0 ? v / to.scale[j] : 0;
      for (let m = 0; m < d; m++) weights[m * k + c] += to.rotation[j * d + m] * scaled;
    }
  }
  return { d, k, weights, intercept };
}
