import { columnStatistics } from '../stats/columns.js';
import { distinctRows } from './distinct.js';
import { addScaled } from './vector.js';

/**
 * Linear centered kernel alignment between two representations of the same n rows
 * (Kornblith et al. 2019, ICML, eq. for linear CKA):
 * CKA = ‖YᵀX‖²_F / (‖XᵀX‖_F · ‖YᵀY‖_F), columns centred first, sums in float64.
 * Works on the [n, d] features directly (d×d products), never on n×n Gram matrices.
 * 1 means the two differ only by an orthogonal map and a scale; NaN when either side is
 * constant (a zero denominator: no variance to compare).
 */
export function linearCka(
  X: Float32Array, // [n, dx]
  Y: Float32Array, // [n, dy]
  n: number,
  dx: number,
  dy: number,
): number {
  if (n < 1 || X.length !== n * dx || Y.length !== n * dy) {
    throw new Error(`linearCka: expected X ${n}×${dx} and Y ${n}×${dy}, got ${X.length} and ${Y.length} values`);
  }
  return preparedCka(prepareCka(X, n, dx), prepareCka(Y, n, dy));
}

/**
 * A representation centred once, with ‖XᵀX‖_F, for comparing it with many others. Each
 * distinct row is stored once with how often it occurs: the clean features of a grid
 * world's test rows repeat a few hundred views, which makes every product over rows a
 * product over those views.
 */
export interface CkaOperand {
  readonly n: number;
  readonly d: number;
  /** Centred distinct rows. */
  readonly centred: Float64Array; // [distinct, d]
  /** For each row, its row of `centred`. */
  readonly index: Int32Array; // [n]
  /** ‖XᵀX‖_F of the centred columns. */
  readonly selfNorm: number;
}

/** Centres the columns of X [n, d] and computes ‖XᵀX‖_F, once per representation. */
export function prepareCka(X: Float32Array, n: number, d: number): CkaOperand {
  if (n < 1 || X.length !== n * d) throw new Error(`prepareCka: expected ${n}×${d} values, got ${X.length}`);
  const { first, index } = distinctRows([X], n);
  const { mean } = columnStatistics(X, d, { kind: 'keep' });
  const centred = new Float64Array(first.length * d); // [distinct, d]
  first.forEach((row, u) => {
    for (let j = 0; j < d; j++) centred[u * d + j] = X[row * d + j] - mean[j];
  });
  const operand = { n, d, centred, index, selfNorm: 0 };
  return { ...operand, selfNorm: Math.sqrt(frobeniusSquaredOfProduct(operand, operand)) };
}

/** Linear CKA of two prepared representations of the same rows; NaN when either is constant. */
export function preparedCka(a: CkaOperand, b: CkaOperand): number {
  if (a.n !== b.n) throw new Error(`linearCka: the representations have ${a.n} and ${b.n} rows`);
  const denominator = a.selfNorm * b.selfNorm;
  return denominator === 0 ? NaN : frobeniusSquaredOfProduct(a, b) / denominator;
}

/**
 * ‖AᵀB‖²_F = ‖Σ_i a_i b_iᵀ‖²_F, summed over the distinct rows of the operand with fewer:
 * Σ_u a_u (Σ_{i∈u} b_i)ᵀ. With A = B, only the upper triangle of the symmetric product is
 * accumulated (half the work).
 */
function frobeniusSquaredOfProduct(a: CkaOperand, b: CkaOperand): number {
  const [grouped, other] = a.centred.length / a.d <= b.centred.length / b.d ? [a, b] : [b, a];
  const distinct = grouped.centred.length / grouped.d;
  const sums = new Float64Array(distinct * other.d); // [distinct, other.d]: Σ of the other's rows over each group
  for (let i = 0; i < grouped.n; i++) addScaled(sums, grouped.index[i] * other.d, 1, other.centred, other.index[i] * other.d, other.d);
  const symmetric = a === b;
  const product = new Float64Array(grouped.d * other.d); // [grouped.d, other.d]
  for (let u = 0; u < distinct; u++) {
    for (let j = 0; j < grouped.d; j++) {
      const v = grouped.centred[u * grouped.d + j];
      const from = symmetric ? j : 0;
      if (v !== 0) addScaled(product, j * other.d + from, v, sums, u * other.d + from, other.d - from);
    }
  }
  let sum = 0;
  for (let j = 0; j < grouped.d; j++) {
    for (let k = symmetric ? j : 0; k < other.d; k++) sum += (symmetric && k > j ? 2 : 1) * product[j * other.d + k] ** 2;
  }
  return sum;
}
