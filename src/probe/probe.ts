import type { Dataset } from '../collect/dataset.js';
import { changeBasis, featureBasis, onRawFeatures, toBasis, type BasisRows, type FeatureBasis } from './basis.js';
import { multiplicity, type DistinctFeatures } from './distinct.js';
import { predictLinear, type LinearModel } from './linear.js';
import { READOUTS, scoreRows, type LabelledRows, type Readout } from './readout.js';
import { takeRows } from './rows.js';
import type { ProbeTarget, TargetLabels } from './targets.js';

/** One split's encoded rows: their dataset steps and the features of each distinct input. */
export interface EncodedSplit {
  readonly steps: Int32Array; // [n], in row order
  readonly encoded: DistinctFeatures;
}

/** Training and validation rows in the basis fitted on those training rows. */
export interface FitRows {
  readonly basis: FeatureBasis;
  readonly train: { readonly steps: Int32Array; readonly rows: BasisRows };
  readonly validation: { readonly steps: Int32Array; readonly rows: BasisRows };
}

/** The basis of the training rows (one decomposition, shared by every target and every penalty) and both splits in it. */
export function fitRows(train: EncodedSplit, validation: EncodedSplit, d: number): FitRows {
  const basis = featureBasis(train.encoded.features, train.encoded.distinct, d, multiplicity(train.encoded.index, train.encoded.distinct));
  const project = ({ steps, encoded }: EncodedSplit) => ({ steps, rows: { z: toBasis(basis, encoded.features, encoded.distinct), index: encoded.index } });
  return { basis, train: project(train), validation: project(validation) };
}

/** `limit` of the split's rows spread evenly over it (deterministic, covering every part of the split). */
export function evenSubsample(split: EncodedSplit, limit: number, d: number): EncodedSplit {
  const n = split.steps.length;
  const m = Math.min(n, limit);
  const picked = Int32Array.from({ length: m }, (_, i) => Math.floor((i * n) / m));
  const local = new Int32Array(split.encoded.distinct).fill(-1); // distinct row of the split → of the subsample
  const kept: number[] = [];
  const index = Int32Array.from(picked, (p) => {
    const u = split.encoded.index[p];
    if (local[u] < 0) local[u] = kept.push(u) - 1;
    return local[u];
  });
  const features = takeRows(split.encoded.features, d, kept);
  return { steps: Int32Array.from(picked, (p) => split.steps[p]), encoded: { features, distinct: kept.length, index } };
}

/** A read-out for one target, fitted on clean training features. */
export interface FittedProbe {
  readonly target: ProbeTarget;
  readonly readout: Readout;
  /** The same read-out written on raw features, so test rows are scored without projecting them. */
  readonly onFeatures: LinearModel;
}

/**
 * Fits the target's read-out on every training row at the penalty chosen on validation
 * rows. When the read-out's penalty path runs on fewer rows than the split holds, it
 * runs on `pathRows(limit)` (an even subsample in its own basis: the solver's curvature
 * bound needs ZᵀZ/n diagonal on the rows it fits), and the choice is refitted on all
 * rows from there.
 */
export function fitProbe(target: ProbeTarget, data: Dataset, all: FitRows, pathRows: (limit: number) => FitRows): FittedProbe {
  const kind = READOUTS[target.kind];
  const labelled = (rows: FitRows): { train: LabelledRows; validation: LabelledRows } => ({
    train: { rows: rows.train.rows, labels: target.labels(data, rows.train.steps) },
    validation: { rows: rows.validation.rows, labels: target.labels(data, rows.validation.steps) },
  });
  const selection = all.train.steps.length > kind.selectionRows ? pathRows(kind.selectionRows) : all;
  const path = labelled(selection);
  const choice = kind.path(path.train, path.validation, selection.basis.eigen);
  const final = selection === all ? path : labelled(all);
  const start = selection === all ? choice.model : changeBasis(choice.model, selection.basis, all.basis);
  const model = kind.refit(final.train, choice.alpha, all.basis.eigen, start);
  const readout = { alpha: choice.alpha, model, validationScore: scoreRows(model, final.validation, kind.score) };
  return { target, readout, onFeatures: onRawFeatures(model, all.basis) };
}

/** The probe's metric on raw features [n, d] of n rows with their labels. */
export function scoreProbe(probe: FittedProbe, features: Float32Array, labels: TargetLabels): number {
  const n = features.length / probe.onFeatures.d;
  if (!Number.isInteger(n)) throw new Error(`scoreProbe: ${features.length} values are not rows of ${probe.onFeatures.d} features`);
  return READOUTS[probe.target.kind].score(predictLinear(probe.onFeatures, features, n), labels);
}

/**
 * Chance accuracy: the majority class's share of the training rows, the accuracy of the
 * best constant guess a featureless read-out could learn from them. It is the chance term
 * of the corrected score (correctedScore), and it comes from training rows only, so test
 * labels never enter it. NaN when there are no training rows.
 */
export function chanceLevel(target: ProbeTarget, data: Dataset, trainRows: ArrayLike<number>): number {
  const train = target.labels(data, trainRows);
  if (train.kind !== 'categorical') throw new Error(`chanceLevel: target '${target.name}' is not categorical`);
  if (train.classes.length === 0) return NaN;
  const counts = new Int32Array(train.classCount);
  for (const c of train.classes) counts[c]++;
  return Math.max(...counts) / train.classes.length;
}
