import type { BasisRows } from './basis.js';
import { predictLinear, type LinearModel } from './linear.js';
import { accuracy, argmaxRows, fitLogistic, TOLERANCE } from './logistic.js';
import { r2Score, ridgeFromMoments, ridgeMoments } from './ridge.js';
import { takeRows } from './rows.js';
import type { TargetLabels } from './targets.js';

/** Rows in basis coordinates with their labels. */
export interface LabelledRows {
  readonly rows: BasisRows;
  readonly labels: TargetLabels;
}

/** A read-out fitted on training rows, in basis coordinates, with its penalty chosen on validation rows. */
export interface Readout {
  readonly alpha: number;
  readonly validationScore: number;
  readonly model: LinearModel;
}

/** One kind of linear read-out and its penalty grid. */
export interface ReadoutKind {
  readonly metric: 'r2' | 'accuracy';
  /** Penalties α tried, largest first (per-sample scale, for standardised features). */
  readonly alphas: readonly number[];
  /**
   * Most training rows the penalty path runs on. With more, the path runs on an even
   * subsample of this many rows; either way the chosen α is refitted on all of them.
   */
  readonly selectionRows: number;
  /** Fits along the α grid and keeps the best model on validation (iterative fits may stop early: refit the choice). */
  path(train: LabelledRows, validation: LabelledRows, eigen: Float64Array): Readout;
  /** Fits at one α to full precision, starting from `start` when the solver is iterative. */
  refit(train: LabelledRows, alpha: number, eigen: Float64Array, start: LinearModel): LinearModel;
  /** The metric of predictions [n, k] of n labelled rows: R² or accuracy. */
  score(predictions: Float64Array, labels: TargetLabels): number;
}

/** Decades from 10^hi down to 10^lo, written exactly (1e-5, not 9.999…e-6). */
function decades(hi: number, lo: number): number[] {
  return Array.from({ length: hi - lo + 1 }, (_, i) => Number(`1e${hi - i}`));
}

/**
 * Ridge regression scored by R² (averaged over outputs). The grid 10³ … 10⁻⁶ spans
 * "shrink everything" to "nearly least squares" for standardised features (common
 * practice); every α costs O(d·k) once the moments are known.
 */
const ridge: ReadoutKind = {
  metric: 'r2',
  alphas: decades(3, -6),
  selectionRows: Infinity, // the whole path costs one pass over the rows
  path(train, validation, eigen) {
    const y = continuous(train.labels);
    const moments = ridgeMoments(train.rows, y.values, y.outputs, eigen);
    return choosePenalty(this.alphas, validation, (alpha) => ridgeFromMoments(moments, alpha), this.score, Infinity);
  },
  refit(train, alpha, eigen) {
    const y = continuous(train.labels);
    return ridgeFromMoments(ridgeMoments(train.rows, y.values, y.outputs, eigen), alpha);
  },
  score(predictions, labels) {
    const y = continuous(labels);
    return r2Score(y.values, predictions, y.values.length / y.outputs, y.outputs);
  },
};

/**
 * Path fits stop at ½gᵀM⁻¹g < 1e-5 nats, ten times coarser than a final fit: they only
 * rank penalties by validation accuracy, whose step (one row in 3000, 3e-4) no such
 * remainder can move; the refit at the chosen α runs to the full tolerance (measured:
 * this halves the path's iterations).
 */
const PATH_TOLERANCE = 10 * TOLERANCE;

/**
 * Multinomial logistic regression scored by accuracy. Chosen over a one-vs-rest ridge
 * classifier because least squares on class indicators masks a class lying between two
 * others (Hastie et al. 2009, ESL §4.2): on Iris it reaches only 0.85 resubstitution
 * accuracy, logistic regression 0.98. The grid 10⁰ … 10⁻⁴ runs from strong to weak
 * penalties, each fit warm-started from the previous one, and the path stops after two
 * weaker penalties in a row fail to beat the best validation accuracy: weak penalties
 * cost the most iterations and rarely help once accuracy has stopped rising (common
 * practice, as early exits on regularisation paths). The path runs on at most 3000
 * training rows: validation accuracy ranks penalties about as well from a few thousand
 * rows (common practice); the chosen α is then refitted once on every training row.
 */
const logistic: ReadoutKind = {
  metric: 'accuracy',
  alphas: decades(0, -4),
  selectionRows: 3000,
  path(train, validation, eigen) {
    const y = categorical(train.labels);
    let previous: LinearModel | undefined;
    const fitAt = (alpha: number): LinearModel => {
      previous = fitLogistic(train.rows, y.classes, eigen, y.classCount, alpha, previous, PATH_TOLERANCE);
      return previous;
    };
    return choosePenalty(this.alphas, validation, fitAt, this.score, 2);
  },
  refit(train, alpha, eigen, start) {
    const y = categorical(train.labels);
    return fitLogistic(train.rows, y.classes, eigen, y.classCount, alpha, start);
  },
  score(predictions, labels) {
    const y = categorical(labels);
    return accuracy(argmaxRows(predictions, y.classes.length, predictions.length / y.classes.length), y.classes);
  },
};

/** The read-out for each kind of target. */
export const READOUTS: Readonly<Record<TargetLabels['kind'], ReadoutKind>> = { continuous: ridge, categorical: logistic };

/**
 * Fits along the grid (largest α first) and keeps the model with the best validation
 * score; a later α must be strictly better, so ties go to the stronger penalty. Stops
 * after `patience` successive α without improvement. Only validation rows are scored
 * here: test rows never reach this function.
 */
function choosePenalty(
  alphas: readonly number[],
  validation: LabelledRows,
  fitAt: (alpha: number) => LinearModel,
  score: ReadoutKind['score'],
  patience: number,
): Readout {
  let best: Readout | undefined;
  let sinceBest = 0;
  for (const alpha of alphas) {
    const model = fitAt(alpha);
    const candidate = { alpha, model, validationScore: scoreRows(model, validation, score) };
    const better = best === undefined || candidate.validationScore > best.validationScore || (Number.isNaN(best.validationScore) && !Number.isNaN(candidate.validationScore));
    if (better) best = candidate;
    sinceBest = better ? 0 : sinceBest + 1;
    if (sinceBest >= patience) break;
  }
  if (best === undefined) throw new Error('choosePenalty: the penalty grid is empty');
  return best;
}

/** The metric of a model on labelled rows: predictions once per distinct vector, then one per row. */
export function scoreRows(model: LinearModel, labelled: LabelledRows, score: ReadoutKind['score']): number {
  const { z, index } = labelled.rows;
  const distinct = predictLinear(model, z, z.length / model.d); // [distinct, k]
  return score(takeRows(distinct, model.k, index), labelled.labels);
}

function continuous(labels: TargetLabels): Extract<TargetLabels, { kind: 'continuous' }> {
  if (labels.kind !== 'continuous') throw new Error('ridge read-out needs continuous labels');
  return labels;
}

function categorical(labels: TargetLabels): Extract<TargetLabels, { kind: 'categorical' }> {
  if (labels.kind !== 'categorical') throw new Error('logistic read-out needs class labels');
  return labels;
}
