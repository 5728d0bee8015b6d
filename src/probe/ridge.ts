import type { BasisRows } from './basis.js';
import type { LinearModel } from './linear.js';

/** What a ridge path needs from the training rows: the projections zᵀy/n and the mean of y. */
export interface RidgeMoments {
  readonly d: number;
  readonly k: number;
  readonly eigen: Float64Array; // [d]
  readonly zy: Float64Array; // [d, k]
  readonly yMean: Float64Array; // [k]
}

/**
 * The training moments of a ridge fit in a basis where ZᵀZ/n = diag(eigen), from n
 * labelled rows whose vectors `rows` stores once each: zᵀ(y − ȳ)/n = Σ_u z_u·Σ_{i∈u}(y_i − ȳ)/n.
 */
export function ridgeMoments(rows: BasisRows, y: Float64Array, k: number, eigen: Float64Array): RidgeMoments {
  const d = eigen.length;
  const { z, index } = rows;
  const n = index.length;
  const distinct = z.length / d;
  if (n < 1 || !Number.isInteger(distinct) || y.length !== n * k) throw new Error(`ridgeMoments: expected ${n} labelled rows of ${d} features and ${k} outputs`);
  const yMean = new Float64Array(k);
  for (let i = 0; i < n; i++) for (let c = 0; c < k; c++) yMean[c] += y[i * k + c] / n;
  const residualSums = new Float64Array(distinct * k); // [distinct, k]: Σ (y − ȳ) over the rows of each vector
  for (let i = 0; i < n; i++) for (let c = 0; c < k; c++) residualSums[index[i] * k + c] += y[i * k + c] - yMean[c];
  const zy = new Float64Array(d * k);
  for (let u = 0; u < distinct; u++) {
    for (let j = 0; j < d; j++) {
      const a = z[u * d + j] / n;
      for (let c = 0; c < k; c++) zy[j * k + c] += a * residualSums[u * k + c];
    }
  }
  return { d, k, eigen, zy, yMean };
}

/**
 * Ridge regression minimising (1/n)‖y − b − Zw‖² + α‖w‖², in closed form:
 * w_j = (z_jᵀy/n) / (eigen_j + α) (ESL §3.4.1, eq. 3.47, with the SVD written as an
 * eigendecomposition of ZᵀZ). Null-space directions (eigen_j = 0) get weight 0, so
 * α → 0 gives the minimum-norm least-squares solution.
 */
export function ridgeFromMoments(m: RidgeMoments, alpha: number): LinearModel {
  if (!(alpha >= 0)) throw new Error(`ridge penalty α must be ≥ 0, got ${alpha}`);
  const { d, k, eigen, zy } = m;
  const weights = new Float64Array(d * k);
  for (let j = 0; j < d; j++) {
    if (eigen[j] === 0) continue;
    for (let c = 0; c < k; c++) weights[j * k + c] = zy[j * k + c] / (eigen[j] + alpha);
  }
  return { d, k, weights, intercept: Float64Array.from(m.yMean) };
}

/**
 * The coefficient of determination R² = 1 − SS_res/SS_tot per output, SS_tot around the
 * scored rows' own mean, averaged over outputs. NaN when an output is constant on the
 * scored rows (SS_tot = 0), where R² is undefined.
 */
export function r2Score(yTrue: Float64Array, yPred: Float64Array, n: number, k: number): number {
  if (n < 1) return NaN;
  let total = 0;
  for (let c = 0; c < k; c++) {
    let mean = 0;
    for (let i = 0; i < n; i++) mean += yTrue[i * k + c] / n;
    let ssRes = 0;
    let ssTot = 0;
    for (let i = 0; i < n; i++) {
      ssRes += (yTrue[i * k + c] - yPred[i * k + c]) ** 2;
      ssTot += (yTrue[i * k + c] - mean) ** 2;
    }
    if (ssTot === 0) return NaN;
    total += 1 - ssRes / ssTot;
  }
  return total / k;
}
