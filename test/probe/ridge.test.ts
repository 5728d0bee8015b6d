import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../../src/random.js';
import { featureBasis, toBasis } from '../../src/probe/basis.js';
import { predictLinear } from '../../src/probe/linear.js';
import { r2Score, ridgeFromMoments, ridgeMoments } from '../../src/probe/ridge.js';
import { everyRow } from './fixture.js';

const n = 80;
const d = 5;
const k = 2;

/** Correlated features (column j mixes the earlier ones) and two noisy linear outputs. */
function problem(seed: number, rows: number): { X: Float32Array; Y: Float64Array } {
  const rng = createRng(seed, 'ridge-test');
  const X = new Float32Array(rows * d);
  const Y = new Float64Array(rows * k);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < d; j++) X[i * d + j] = 3 * j + (j > 0 ? 0.8 * X[i * d + j - 1] : 0) + (j + 1) * normal(rng);
    Y[i * k] = 2 + X[i * d] - 0.5 * X[i * d + 3] + 0.3 * normal(rng);
    Y[i * k + 1] = -1 + 0.2 * X[i * d + 2] + 0.3 * normal(rng);
  }
  return { X, Y };
}

/** Design matrix [1, standardised X] with the training mean and population std. */
function design(X: Float32Array, rows: number, mean: number[], std: number[]): Matrix {
  return new Matrix(Array.from({ length: rows }, (_, i) => [1, ...mean.map((m, j) => (X[i * d + j] - m) / std[j])]));
}

function ourPredictions(train: { X: Float32Array; Y: Float64Array }, query: Float32Array, rows: number, alpha: number): Float64Array {
  const basis = featureBasis(train.X, n, d);
  const model = ridgeFromMoments(ridgeMoments(everyRow(toBasis(basis, train.X, n), n), train.Y, k, basis.eigen), alpha);
  return predictLinear(model, toBasis(basis, query, rows), rows);
}

function columnStats(X: Float32Array): { mean: number[]; std: number[] } {
  const mean = Array.from({ length: d }, (_, j) => Array.from({ length: n }, (_, i) => X[i * d + j]).reduce((a, b) => a + b) / n);
  const std = mean.map((m, j) => Math.sqrt(Array.from({ length: n }, (_, i) => (X[i * d + j] - m) ** 2).reduce((a, b) => a + b) / n));
  return { mean, std };
}

describe('ridge regression', () => {
  it('matches the normal-equations solution (AᵀA + nαP)w = AᵀY solved by ml-matrix, intercept unpenalised, to 1e-8', () => {
    const train = problem(1, n);
    const query = problem(2, 30);
    const { mean, std } = columnStats(train.X);
    const A = design(train.X, n, mean, std);
    for (const alpha of [0.01, 0.3, 5]) {
      const penalty = Matrix.eye(d + 1).mul(n * alpha);
      penalty.set(0, 0, 0);
      const W = solve(A.transpose().mmul(A).add(penalty), A.transpose().mmul(new Matrix(Array.from({ length: n }, (_, i) => [train.Y[2 * i], train.Y[2 * i + 1]]))));
      const expected = design(query.X, 30, mean, std).mmul(W);
      const ours = ourPredictions(train, query.X, 30, alpha);
      for (let i = 0; i < 30; i++) for (let c = 0; c < k; c++) expect(ours[i * k + c]).toBeCloseTo(expected.get(i, c), 8);
    }
  });

  it('recovers ordinary least squares (ml-matrix QR solve of A w = Y) as α → 0, to 1e-8', () => {
    const train = problem(3, n);
    const query = problem(4, 30);
    const { mean, std } = columnStats(train.X);
    const W = solve(design(train.X, n, mean, std), new Matrix(Array.from({ length: n }, (_, i) => [train.Y[2 * i], train.Y[2 * i + 1]])));
    const expected = design(query.X, 30, mean, std).mmul(W);
    const ours = ourPredictions(train, query.X, 30, 0);
    for (let i = 0; i < 30; i++) for (let c = 0; c < k; c++) expect(ours[i * k + c]).toBeCloseTo(expected.get(i, c), 8);
  });

  it('gives a constant feature zero weight instead of dividing by its zero std', () => {
    const train = problem(5, n);
    for (let i = 0; i < n; i++) train.X[i * d + 2] = 7;
    const basis = featureBasis(train.X, n, d);
    expect(basis.scale[2]).toBe(0);
    const query = problem(6, 10).X;
    const predictions = ourPredictions(train, query, 10, 0);
    expect(predictions.every(Number.isFinite)).toBe(true);
  });
});

describe('ridgeMoments', () => {
  it('gives rows stored once with an index the moments of the same rows written out, to 1e-12', () => {
    const train = problem(7, n);
    const index = Int32Array.from({ length: 2 * n }, (_, i) => (i < n ? i : (7 * i) % n)); // a second visit of every row, shuffled (7 and 80 are coprime)
    const Y = Float64Array.from(Array.from(index).flatMap((u) => [train.Y[2 * u], train.Y[2 * u + 1]]));
    const basis = featureBasis(train.X, n, d, Int32Array.from({ length: n }, () => 2));
    const z = toBasis(basis, train.X, n);
    const written = Float64Array.from(Array.from(index).flatMap((u) => Array.from(z.subarray(u * d, u * d + d))));
    const grouped = ridgeMoments({ z, index }, Y, k, basis.eigen);
    const plain = ridgeMoments(everyRow(written, 2 * n), Y, k, basis.eigen);
    grouped.zy.forEach((v, p) => expect(v).toBeCloseTo(plain.zy[p], 12));
    grouped.yMean.forEach((v, c) => expect(v).toBeCloseTo(plain.yMean[c], 12));
  });
});

describe('r2Score', () => {
  it('is 1 − SS_res/SS_tot: y = 1,2,3,4 and ŷ = 1,2,3,5 give 1 − 1/5 = 0.8 (hand computed)', () => {
    expect(r2Score(Float64Array.of(1, 2, 3, 4), Float64Array.of(1, 2, 3, 5), 4, 1)).toBeCloseTo(0.8, 12);
  });

  it('averages over outputs: a perfect output and a mean-only output give (1 + 0)/2', () => {
    const y = Float64Array.of(1, 10, 2, 20, 3, 30);
    const prediction = Float64Array.of(1, 20, 2, 20, 3, 20);
    expect(r2Score(y, prediction, 3, 2)).toBeCloseTo(0.5, 12);
  });

  it('is NaN when the scored output is constant (R² undefined)', () => {
    expect(r2Score(Float64Array.of(2, 2, 2), Float64Array.of(1, 2, 3), 3, 1)).toBeNaN();
  });
});
