import type { Dataset } from '../collect/dataset.js';
import { changeBasis, featureBasis, toBasis, type FeatureBasis } from './basis.js';
import { READOUTS, readoutAt, type LabelledRows, type Readout, type ReadoutKind } from './readout.js';
import type { LinearModel } from './ridge.js';
import type { DefinedLabels, ProbeTarget, TargetLabels } from './targets.js';

/** Features of one split in the shared training basis: raw [n, d] and projected z [n, d]. */
export interface SplitFeatures {
  readonly rows: ArrayLike<number>; // dataset step indices, in feature-row order
  readonly features: Float32Array; // [rows.length, d]
  readonly z: Float64Array; // [rows.length, d] in `basis`
  readonly basis: FeatureBasis;
}

/** A read-out for one target, fitted on clean training features. */
export interface FittedProbe {
  readonly target: ProbeTarget;
  readonly basis: FeatureBasis;
  readonly readout: Readout;
}

/** Labels of the test rows where the target is defined, extracted once and scored at every severity. */
export interface TestLabels {
  readonly probe: FittedProbe;
  readonly defined: DefinedLabels;
  readonly rowCount: number;
}

/**
 * Fits the target's read-out on training rows, choosing its penalty on validation rows.
 * Rows where the target is undefined are left out; if that leaves a split empty the
 * target cannot be probed on this data, and the error says so.
 */
export function fitProbe(target: ProbeTarget, data: Dataset, train: SplitFeatures, validation: SplitFeatures): FittedProbe {
  const trainLabels = definedOrThrow(target, data, train.rows, 'training', 2);
  const validationLabels = definedOrThrow(target, data, validation.rows, 'validation', 1);
  const d = train.basis.d;
  const basis = trainLabels.keep.length === train.rows.length
    ? train.basis // the shared basis is centred on exactly these rows
    : featureBasis(takeRows(train.features, d, trainLabels.keep), trainLabels.keep.length, d);
  const project = (split: SplitFeatures, keep: Int32Array): Float64Array =>
    basis === split.basis ? takeRows(split.z, d, keep) : toBasis(basis, takeRows(split.features, d, keep), keep.length);
  const trainRows: LabelledRows = { z: project(train, trainLabels.keep), n: trainLabels.keep.length, labels: trainLabels.labels };
  const validationRows: LabelledRows = { z: project(validation, validationLabels.keep), n: validationLabels.keep.length, labels: validationLabels.labels };
  const kind = READOUTS[target.kind];
  if (trainRows.n <= kind.selectionRows) {
    const choice = kind.fit(trainRows, validationRows, basis.eigen);
    return { target, basis, readout: refit(kind, trainRows, validationRows, basis.eigen, choice.alpha, choice.model) };
  }
  // Choose α on an even subsample, in that subsample's own basis (the solver's curvature
  // bound needs ZᵀZ/n diagonal on the rows it fits), then refit on all rows from there.
  const picked = evenSubsample(trainRows.n, kind.selectionRows);
  const subFeatures = takeRows(train.features, d, Int32Array.from(picked, (p) => trainLabels.keep[p]));
  const subBasis = featureBasis(subFeatures, picked.length, d);
  const choice = kind.fit(
    { z: toBasis(subBasis, subFeatures, picked.length), n: picked.length, labels: subsetLabels(trainLabels.labels, picked) },
    { ...validationRows, z: toBasis(subBasis, takeRows(validation.features, d, validationLabels.keep), validationRows.n) },
    subBasis.eigen,
  );
  const start = changeBasis(choice.model, subBasis, basis);
  return { target, basis, readout: refit(kind, trainRows, validationRows, basis.eigen, choice.alpha, start) };
}

/** The final read-out: fitted on all training rows at the chosen α, its validation score recomputed. */
function refit(kind: ReadoutKind, train: LabelledRows, validation: LabelledRows, eigen: Float64Array, alpha: number, start: LinearModel): Readout {
  const model = kind.refit(train, alpha, eigen, start);
  return readoutAt(alpha, model, kind.score(model, validation), kind.score);
}

/** m positions spread evenly over 0..n−1 (deterministic, covering every part of the split). */
export function evenSubsample(n: number, m: number): Int32Array {
  return Int32Array.from({ length: Math.min(n, m) }, (_, i) => Math.floor((i * n) / Math.min(n, m)));
}

/** The labels at the given positions. */
function subsetLabels(labels: TargetLabels, positions: Int32Array): TargetLabels {
  if (labels.kind === 'categorical') return { ...labels, classes: Int32Array.from(positions, (p) => labels.classes[p]) };
  return { ...labels, values: takeRows(labels.values, labels.outputs, positions) };
}

/** The test labels of a fitted probe, for scoring it on clean and corrupted features alike. */
export function testLabels(probe: FittedProbe, data: Dataset, testRows: ArrayLike<number>): TestLabels {
  return { probe, defined: definedOrThrow(probe.target, data, testRows, 'test', 1), rowCount: testRows.length };
}

/** The probe's metric on test features given raw [n, d] and in the shared basis. */
export function scoreProbe(labels: TestLabels, features: Float32Array, z: Float64Array, sharedBasis: FeatureBasis): number {
  const { probe, defined } = labels;
  const d = probe.basis.d;
  if (features.length !== labels.rowCount * d) throw new Error(`scoreProbe: expected ${labels.rowCount}×${d} features, got ${features.length} values`);
  const projected = probe.basis === sharedBasis
    ? takeRows(z, d, defined.keep)
    : toBasis(probe.basis, takeRows(features, d, defined.keep), defined.keep.length);
  return probe.readout.score({ z: projected, n: defined.keep.length, labels: defined.labels });
}

/**
 * Chance accuracy: the share of test rows whose class is the most frequent class of the
 * training rows, i.e. the test accuracy of the best constant guess a featureless read-out
 * could learn. Taking the majority from training keeps test labels out of the choice.
 */
export function chanceLevel(target: ProbeTarget, data: Dataset, trainRows: ArrayLike<number>, testRows: ArrayLike<number>): number {
  const train = target.labels(data, trainRows).labels;
  const test = target.labels(data, testRows).labels;
  if (train.kind !== 'categorical' || test.kind !== 'categorical') throw new Error(`chanceLevel: target '${target.name}' is not categorical`);
  const counts = new Int32Array(train.classCount);
  for (const c of train.classes) counts[c]++;
  let majority = 0;
  for (let c = 1; c < counts.length; c++) if (counts[c] > counts[majority]) majority = c;
  if (test.classes.length === 0) return NaN;
  return test.classes.filter((c) => c === majority).length / test.classes.length;
}

function definedOrThrow(target: ProbeTarget, data: Dataset, rows: ArrayLike<number>, split: string, minimum: number): DefinedLabels {
  const defined = target.labels(data, rows);
  if (defined.keep.length < minimum) {
    throw new Error(
      `probe target '${target.name}' is defined on ${defined.keep.length} of ${rows.length} ${split} rows (needs ${minimum}); ` +
      'it is NaN where the world lacks it, e.g. nearest_* in a world without emitters',
    );
  }
  return defined;
}

/** The given rows of a row-major [n, d] array, in order. */
export function takeRows<T extends Float32Array | Float64Array>(values: T, d: number, rows: ArrayLike<number>): T {
  const out = new (values.constructor as new (length: number) => T)(rows.length * d);
  for (let i = 0; i < rows.length; i++) out.set(values.subarray(rows[i] * d, rows[i] * d + d), i * d);
  return out;
}
