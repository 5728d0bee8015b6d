import { describe, expect, it } from 'vitest';
import { toBasis } from '../../src/probe/basis.js';
import { predictLinear, type LinearModel } from '../../src/probe/linear.js';
import { fitLogistic } from '../../src/probe/logistic.js';
import { evenSubsample, fitProbe, fitRows, scoreProbe } from '../../src/probe/probe.js';
import { READOUTS } from '../../src/probe/readout.js';
import { takeRows } from '../../src/probe/rows.js';
import { probeTarget } from '../../src/probe/targets.js';
import { fixtureDataset, linearEncoder } from './fixture.js';

describe('evenSubsample', () => {
  const split = (steps: number[], index: number[]) => ({
    steps: Int32Array.from(steps),
    encoded: { features: Float32Array.from({ length: 3 * Math.max(...index, -1) + 3 }, (_, p) => p), distinct: Math.max(...index, -1) + 1, index: Int32Array.from(index) },
  });

  it('spreads m rows evenly over n (every ⌊n/m⌋-th when m divides n) and keeps the distinct rows they use, in order', () => {
    const sub = evenSubsample(split([10, 11, 12, 13, 14, 15, 16, 17, 18, 19], [0, 1, 2, 1, 3, 3, 0, 4, 2, 1]), 5, 3);
    expect(Array.from(sub.steps)).toEqual([10, 12, 14, 16, 18]);
    expect(Array.from(sub.encoded.index)).toEqual([0, 1, 2, 0, 1]); // distinct rows 0, 2, 3, 0, 2 of the split
    expect(Array.from(sub.encoded.features)).toEqual([0, 1, 2, 6, 7, 8, 9, 10, 11]);
  });

  it('keeps every row when n ≤ m', () => {
    expect(Array.from(evenSubsample(split([4, 5, 6], [0, 1, 0]), 5, 3).steps)).toEqual([4, 5, 6]);
  });
});

describe('fitProbe on more training rows than the penalty path uses', () => {
  const { data, split } = fixtureDataset(6000, 21); // 4200 training rows > 3000
  const { encoder } = linearEncoder(data, ['sight'], 12, 4);
  const encoded = (steps: Int32Array) => ({
    steps,
    encoded: { features: encoder.features({ sight: takeRows(data.channels.sight, data.channelSize.sight, steps) }, steps.length), distinct: steps.length, index: Int32Array.from(steps, (_, i) => i) },
  });
  const train = encoded(split.train);
  const validation = encoded(split.validation);
  const all = fitRows(train, validation, 12);
  const pathRows = (limit: number) => fitRows(evenSubsample(train, limit, 12), validation, 12);

  it('refits the chosen penalty on all training rows: the objective of a cold fit there, to 1e-4 nats', () => {
    expect(split.train.length).toBeGreaterThan(READOUTS.categorical.selectionRows);
    const probe = fitProbe(probeTarget('heading'), data, all, pathRows);
    const classes = Int32Array.from(split.train, (t) => data.latents.heading[t]);
    const alpha = probe.readout.alpha;
    const cold = fitLogistic(all.train.rows, classes, all.basis.eigen, 4, alpha);
    // Both stop at ½gᵀM⁻¹g < 1e-6 nats from different starts; as in the Newton check, that leaves a few 1e-5.
    const objective = (model: LinearModel) => penalisedCrossEntropy(model, all.train.rows.z, classes, alpha);
    expect(Math.abs(objective(probe.readout.model) - objective(cold))).toBeLessThan(1e-4);
  });

  it('reports the validation accuracy of the refitted model, not of the subsample fit', () => {
    const probe = fitProbe(probeTarget('wall_ahead'), data, all, pathRows);
    const labels = probeTarget('wall_ahead').labels(data, split.validation);
    const predictions = predictLinear(probe.readout.model, all.validation.rows.z, split.validation.length);
    expect(probe.readout.validationScore).toBe(READOUTS.categorical.score(predictions, labels));
  });

  it('scores raw test features as the basis model scores their projection (R² to 1e-12)', () => {
    const probe = fitProbe(probeTarget('x'), data, all, pathRows);
    const test = encoded(split.test).encoded.features;
    const labels = probeTarget('x').labels(data, split.test);
    const projected = READOUTS.continuous.score(predictLinear(probe.readout.model, toBasis(all.basis, test, split.test.length), split.test.length), labels);
    expect(scoreProbe(probe, test, labels)).toBeCloseTo(projected, 12);
  });
});

/** (1/n) Σ −log softmax(z·W + b)[y] + (α/2)‖W‖², written out naively. */
function penalisedCrossEntropy(model: LinearModel, z: Float64Array, classes: Int32Array, alpha: number): number {
  const n = classes.length;
  const logits = predictLinear(model, z, n);
  let loss = 0;
  for (let i = 0; i < n; i++) {
    const row = Array.from(logits.subarray(i * model.k, (i + 1) * model.k));
    const max = Math.max(...row);
    loss += (max + Math.log(row.reduce((s, v) => s + Math.exp(v - max), 0)) - row[classes[i]]) / n;
  }
  return loss + (alpha / 2) * model.weights.reduce((s, w) => s + w * w, 0);
}
