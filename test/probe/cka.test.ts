import { determinant, Matrix, QrDecomposition } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../../src/random.js';
import { linearCka, preparedCka, prepareCka } from '../../src/probe/cka.js';

const n = 60;
const d = 6;

function gaussianMatrix(rows: number, cols: number, seed: number): Matrix {
  const rng = createRng(seed, 'cka-test');
  return new Matrix(Array.from({ length: rows }, () => Array.from({ length: cols }, () => normal(rng))));
}

const flat = (m: Matrix): Float32Array => Float32Array.from(m.to1DArray());
const X = gaussianMatrix(n, d, 1).add(3); // an offset, so centring matters

/**
 * The kernel form of linear CKA, HSIC(K, L)/sqrt(HSIC(K, K)·HSIC(L, L)) with K = XXᵀ,
 * L = YYᵀ and HSIC(K, L) = tr(KHLH) (Kornblith et al. 2019, eqs. 3–4; Gretton et al.
 * 2005), computed on n×n matrices with ml-matrix: an independent route to the same number.
 */
function kernelCka(a: Matrix, b: Matrix): number {
  const H = Matrix.eye(n).sub(Matrix.ones(n, n).div(n));
  const K = H.mmul(a.mmul(a.transpose())).mmul(H);
  const L = H.mmul(b.mmul(b.transpose())).mmul(H);
  const hsic = (p: Matrix, q: Matrix) => p.mmul(q).trace();
  return hsic(K, L) / Math.sqrt(hsic(K, K) * hsic(L, L));
}

describe('linearCka (Kornblith et al. 2019, ICML)', () => {
  it('is 1 between X and itself', () => {
    expect(linearCka(flat(X), flat(X), n, d, d)).toBeCloseTo(1, 9);
  });

  it('is 1 under an orthogonal map XQ (invariance to rotation)', () => {
    const Q = new QrDecomposition(gaussianMatrix(d, d, 2)).orthogonalMatrix;
    expect(linearCka(flat(X), flat(X.mmul(Q)), n, d, d)).toBeCloseTo(1, 6);
  });

  it('is 1 under isotropic scaling cX', () => {
    expect(linearCka(flat(X), flat(X.clone().mul(-4.5)), n, d, d)).toBeCloseTo(1, 6);
  });

  it('is below 1 under a generic invertible non-orthogonal map (it is not invariant to those)', () => {
    const A = gaussianMatrix(d, d, 3).add(Matrix.diag([1, 2, 3, 4, 5, 6]));
    expect(Math.abs(determinant(A))).toBeGreaterThan(1e-3); // invertible
    expect(A.transpose().mmul(A).sub(Matrix.eye(d)).norm()).toBeGreaterThan(1); // not orthogonal
    expect(linearCka(flat(X), flat(X.mmul(A)), n, d, d)).toBeLessThan(0.99);
  });

  it('agrees with the n×n kernel form (HSIC) between different-width representations, to 1e-6', () => {
    const Y = X.mmul(gaussianMatrix(d, 4, 4)).add(gaussianMatrix(n, 4, 5));
    expect(linearCka(flat(X), flat(Y), n, d, 4)).toBeCloseTo(kernelCka(X, Y), 6);
  });

  it('agrees with the kernel form when rows repeat (each distinct row counted as often as it occurs), to 1e-9', () => {
    // Rounded to float32 first, so that both routes see the same numbers.
    const float32 = (m: Matrix) => new Matrix(m.to2DArray().map((row) => row.map(Math.fround)));
    const repeated = float32(new Matrix(Array.from({ length: n }, (_, i) => X.getRow(i % 7)))); // 7 distinct rows, as a grid world's views repeat
    const Y = float32(repeated.mmul(gaussianMatrix(d, 4, 8)).add(gaussianMatrix(n, 4, 9))); // every row distinct
    expect(linearCka(flat(repeated), flat(Y), n, d, 4)).toBeCloseTo(kernelCka(repeated, Y), 9);
    expect(linearCka(flat(Y), flat(repeated), n, 4, d)).toBeCloseTo(kernelCka(repeated, Y), 9);
  });

  it('is NaN when one side is constant (nothing to compare)', () => {
    expect(linearCka(flat(X), new Float32Array(n * 2).fill(3), n, d, 2)).toBeNaN();
  });

  it('rejects arrays that do not match the stated shapes', () => {
    expect(() => linearCka(flat(X), flat(X), n, d + 1, d)).toThrow(`linearCka: expected X ${n}×${d + 1} and Y ${n}×${d}`);
  });
});

describe('preparedCka', () => {
  it('equals linearCka when one prepared side is compared with several others, to 1e-12', () => {
    const reference = prepareCka(flat(X), n, d);
    for (const seed of [6, 7]) {
      const Y = X.mmul(gaussianMatrix(d, 3, seed)).add(gaussianMatrix(n, 3, seed + 10));
      expect(preparedCka(reference, prepareCka(flat(Y), n, 3))).toBeCloseTo(linearCka(flat(X), flat(Y), n, d, 3), 12);
    }
  });

  it('rejects representations of different row counts', () => {
    expect(() => preparedCka(prepareCka(flat(X), n, d), prepareCka(new Float32Array(2 * d), 2, d))).toThrow(`linearCka: the representations have ${n} and 2 rows`);
  });
});
