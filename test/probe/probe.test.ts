import { describe, expect, it } from 'vitest';
import { featureBasis, toBasis } from '../../src/probe/basis.js';
import { fitLogistic } from '../../src/probe/logistic.js';
import { evenSubsample, fitProbe, takeRows } from '../../src/probe/probe.js';
import { READOUTS } from '../../src/probe/readout.js';
import { predictLinear, type LinearModel } from '../../src/probe/ridge.js';
import { probeTarget } from '../../src/probe/targets.js';
import { fixtureDataset, linearEncoder } from './fixture.js';

describe('evenSubsample', () => {
  it('spreads m positions evenly over n (every ⌊n/m⌋-th when m divides n)', () => {
    expect(Array.from(evenSubsample(10, 5))).toEqual([0, 2, 4, 6, 8]);
    expect(Array.from(evenSubsample(7, 3))).toEqual([0, 2, 4]);
  });

  it('keeps every position when n ≤ m', () => {
    expect(Array.from(evenSubsample(3, 5))).toEqual([0, 1, 2]);
  });
});

describe('fitProbe on more training rows than the penalty path uses', () => {
  const { data, split } = fixtureDataset(6000, 21); // 4200 training rows > 3000
  const { encoder } = linearEncoder(data, ['sight'], 12, 4);
  const features = (rows: Int32Array) => encoder.features({ sight: takeRows(data.channels.sight, data.channelSize.sight, rows) }, rows.length);
  const trainFeatures = features(split.train);
  const basis = featureBasis(trainFeatures, split.train.length, 12);
  const train = { rows: split.train, features: trainFeatures, z: toBasis(basis, trainFeatures, split.train.length), basis };
  const validationFeatures = features(split.validation);
  const validation = { rows: split.validation, features: validationFeatures, z: toBasis(basis, validationFeatures, split.validation.length), basis };

  it('refits the chosen penalty on all training rows: the objective of a cold fit there, to 1e-4 nats', () => {
    expect(split.train.length).toBeGreaterThan(READOUTS.categorical.selectionRows);
    const probe = fitProbe(probeTarget('heading'), data, train, validation);
    const classes = Int32Array.from(split.train, (t) => data.latents.heading[t]);
    const alpha = probe.readout.alpha;
    const cold = fitLogistic(train.z, classes, split.train.length, basis.eigen, 4, alpha);
    // Both stop at ½gᵀM⁻¹g < 1e-6 nats from different starts; as in the Newton check, that leaves a few 1e-5.
    const objective = (model: LinearModel) => penalisedCrossEntropy(model, train.z, classes, alpha);
    expect(Math.abs(objective(probe.readout.model) - objective(cold))).toBeLessThan(1e-4);
  });

  it('reports the validation accuracy of the refitted model, not of the subsample fit', () => {
    const probe = fitProbe(probeTarget('wall_ahead'), data, train, validation);
    const classes = Int32Array.from(split.validation, (t) => data.latents.wall_ahead[t]);
    expect(probe.readout.validationScore).toBe(probe.readout.score({ z: validation.z, n: split.validation.length, labels: { kind: 'categorical', classes, classCount: 2 } }));
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
