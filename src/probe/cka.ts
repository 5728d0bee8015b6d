import { columnStatistics } from '../stats/columns.js';
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

/** A representation centred once, with ‖XᵀX‖_F, for comparing it with many others. */
export interface CkaOperand {
  readonly centred: Float64Array; // [n, d]
  readonly n: number;
  readonly d: number;
  /** ‖XᵀX‖_F of the centred columns. */
  readonly selfNorm: number;
}

/** Centres the columns of X [n, d] and computes ‖XᵀX‖_F, once per representation. */
export function prepareCka(X: Float32Array, n: number, d: number): CkaOperand {
  if (n < 1 || X.length !== n * d) throw new Error(`prepareCka: expected ${n}×${d} values, got ${X.length}`);
  const centred = centredColumns(X, d);
  return { centred, n, d, selfNorm: Math.sqrt(selfProductNorm(centred, n, d)) };
}

/** Linear CKA of two prepared representations of the same rows; NaN when either is constant. */
export function preparedCka(a: CkaOperand, b: CkaOperand): number {
  if (a.n !== b.n) throw new Error(`linearCka: the representations have ${a.n} and ${b.n} rows`);
  const denominator = a.selfNorm * b.selfNorm;
  return denominator === 0 ? NaN : frobeniusSquaredOfProduct(b.centred, a.centred, a.n, b.d, a.d) / denominator;
}

function centredColumns(values: Float32Array, d: number): Float64Array {
  const { mean } = columnStatistics(values, d, { kind: 'keep' });
  return Float64Array.from(values, (v, p) => v - mean[p % d]);
}

/** ‖AᵀB‖²_F for A [n, da] and B [n, db]. */
function frobeniusSquaredOfProduct(a: Float64Array, b: Float64Array, n: number, da: number, db: number): number {
  const product = new Float64Array(da * db);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < da; j++) {
      const v = a[i * da + j];
      if (v !== 0) addScaled(product, j * db, v, b, i * db, db);
    }
  }
  let sum = 0;
  for (const v of product) sum += v * v;
  return sum;
}

/** ‖AᵀA‖²_F for A [n, d] from the upper triangle of the symmetric product (half the work). */
function selfProductNorm(a: Float64Array, n: number, d: number): number {
  const product = new Float64Array(d * d);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) {
      const v = a[i * d + j];
      if (v !== 0) addScaled(product, j * d + j, v, a, i * d + j, d - j);
    }
  }
  let sum = 0;
  for (let j = 0; j < d; j++) {
    sum += product[j * d + j] ** 2;
    for (let k = j + 1; k < d; k++) sum += 2 * product[j * d + k] ** 2;
  }
  return sum;
}
