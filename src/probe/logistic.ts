import type { BasisRows } from './basis.js';
import type { LinearModel } from './linear.js';
import { addScaled, dot } from './vector.js';

/**
 * When to stop: half the squared gradient in the preconditioner's metric (about the
 * remaining decrease of the mean cross-entropy, in nats) below 1e-6, far finer than
 * anything that moves an accuracy; or an iteration cap (common practice).
 */
export const TOLERANCE = 1e-6;
const MAX_ITERATIONS = 200;

/**
 * Multinomial logistic regression with an L2 penalty on the weights (not the intercept):
 * minimises (1/n) Σ_i −log softmax(z_i·W + b)[y_i] + (α/2)‖W‖².
 *
 * Solver: gradient steps preconditioned by a fixed quadratic majoriser. The Hessian of
 * the mean softmax cross-entropy is bounded by ½(I − 11ᵀ/K) ⊗ ZᵀZ/n (Böhning 1992,
 * Ann. Inst. Statist. Math. 44:197), hence by ½ I ⊗ diag(eigen) in the basis where
 * ZᵀZ/n is diagonal; so the step W ← W − G/(½·eigen_j + α) never overshoots whatever the
 * features' correlations. Nesterov momentum with the gradient restart of O'Donoghue &
 * Candès (2015) speeds it up. Deterministic: it starts from zero or from `start`.
 *
 * Two classes are solved in their two-class form, which has the same minimiser: only
 * u = w₁ − w₀ enters the loss and ‖w₀‖² + ‖w₁‖² is smallest at w₁ = −w₀ = u/2, so the
 * problem is binary logistic regression on u with penalty (α/4)‖u‖², whose Hessian is
 * bounded by ¼·ZᵀZ/n (Böhning & Lindsay 1988, Ann. Inst. Statist. Math. 40:641). One
 * logit instead of two halves the work, and the tighter bound doubles the step.
 */
export function fitLogistic(
  rows: BasisRows, // n rows, centred on them with repeats, each distinct vector stored once
  classes: Int32Array, // [n], 0..classCount−1
  eigen: Float64Array, // [d], diag of ZᵀZ/n
  classCount: number,
  alpha: number,
  start?: LinearModel,
  tolerance = TOLERANCE,
): LinearModel {
  const d = eigen.length;
  const { z, index } = rows;
  const n = index.length;
  if (n < 1 || z.length % d !== 0 || classes.length !== n) throw new Error(`fitLogistic: expected ${n} rows of ${d} features and ${n} labels`);
  if (!(alpha > 0)) throw new Error(`logistic penalty α must be > 0, got ${alpha}`);
  const counts = classCounts(index, classes, z.length / d, classCount);
  const problem: Problem = classCount === 2
    ? { z, counts, n, d, eigen, classCount, logits: 1, penalty: alpha / 2, bound: 0.25, tolerance }
    : { z, counts, n, d, eigen, classCount, logits: classCount, penalty: alpha, bound: 0.5, tolerance };
  const theta = minimise(problem, start === undefined ? new Float64Array(problem.logits * (d + 1)) : fromModel(start, problem.logits));
  return toModel(theta, d, classCount);
}

/**
 * How often each distinct vector occurs with each class, its total last:
 * [distinct, classCount + 1]. The summed cross-entropy of the rows is then a sum over
 * distinct vectors, Σ_u (m_u·log Σ_c exp η_uc − Σ_c n_uc·η_uc), with the same minimiser.
 */
function classCounts(index: Int32Array, classes: Int32Array, distinct: number, classCount: number): Float64Array {
  const stride = classCount + 1;
  const counts = new Float64Array(distinct * stride);
  for (let i = 0; i < index.length; i++) {
    counts[index[i] * stride + classes[i]] += 1;
    counts[index[i] * stride + classCount] += 1;
  }
  return counts;
}

/** The penalised cross-entropy to minimise: `logits` = 1 is the two-class (sigmoid) form. */
interface Problem {
  readonly z: Float64Array; // [distinct, d]
  readonly counts: Float64Array; // [distinct, classCount + 1], see classCounts
  readonly n: number;
  readonly d: number;
  readonly eigen: Float64Array; // [d], diag of ZᵀZ/n
  readonly classCount: number;
  readonly logits: number;
  /** λ in (λ/2)‖W‖². */
  readonly penalty: number;
  /** Bound on the curvature of the loss in one logit (½ softmax, ¼ sigmoid). */
  readonly bound: number;
  /** Stop when ½gᵀM⁻¹g falls below this (nats). */
  readonly tolerance: number;
}

/** Preconditioned accelerated gradient descent from θ₀; θ is [logits, d + 1], the intercept last in each row. */
function minimise(problem: Problem, theta0: Float64Array): Float64Array {
  const { d, penalty, bound } = problem;
  const stride = d + 1;
  const size = theta0.length;
  const curvature = new Float64Array(stride);
  for (let j = 0; j < d; j++) curvature[j] = bound * problem.eigen[j] + penalty;
  curvature[d] = bound;
  let x = Float64Array.from(theta0);
  let next = new Float64Array(size);
  const y = Float64Array.from(theta0);
  const g = new Float64Array(size);
  const scratch = new Float64Array(problem.logits);
  let theta = 1;
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    gradient(problem, y, g, scratch);
    let decrement = 0;
    let ascent = 0;
    for (let p = 0; p < size; p++) {
      const step = g[p] / curvature[p % stride];
      next[p] = y[p] - step;
      decrement += g[p] * step;
      ascent += g[p] * (next[p] - x[p]);
    }
    [x, next] = [next, x];
    if (0.5 * decrement < problem.tolerance) break;
    const restart = ascent > 0;
    const thetaNext = restart ? 1 : (1 + Math.sqrt(1 + 4 * theta * theta)) / 2;
    const momentum = restart ? 0 : (theta - 1) / thetaNext;
    for (let p = 0; p < size; p++) y[p] = x[p] + momentum * (x[p] - next[p]);
    theta = thetaNext;
  }
  return x;
}

/**
 * Gradient of the penalised mean cross-entropy at θ, written into g: each distinct vector
 * once, with the logit residual m_u·p_u − n_u that sums those of all its rows. Class-major
 * rows keep the inner loops over the d features long; `scratch` holds one vector's logits.
 */
function gradient(problem: Problem, theta: Float64Array, g: Float64Array, scratch: Float64Array): void {
  const { z, counts, n, d, classCount, logits: L, penalty } = problem;
  const stride = d + 1;
  const countStride = classCount + 1;
  g.fill(0);
  for (let u = 0; u < z.length / d; u++) {
    const row = u * d;
    const at = u * countStride;
    const total = counts[at + classCount];
    if (total === 0) continue;
    for (let c = 0; c < L; c++) scratch[c] = theta[c * stride + d] + dot(z, row, theta, c * stride, d);
    // m·p − counts: the gradient of the summed cross-entropy with respect to the logits
    if (L === 1) scratch[0] = total / (1 + Math.exp(-scratch[0])) - counts[at + 1];
    else {
      softmaxInPlace(scratch);
      for (let c = 0; c < L; c++) scratch[c] = total * scratch[c] - counts[at + c];
    }
    for (let c = 0; c < L; c++) {
      addScaled(g, c * stride, scratch[c] / n, z, row, d);
      g[c * stride + d] += scratch[c] / n;
    }
  }
  for (let c = 0; c < L; c++) for (let j = 0; j < d; j++) g[c * stride + j] += penalty * theta[c * stride + j];
}

/** Replaces logits by their softmax, shifting by the maximum so exp never overflows. */
function softmaxInPlace(v: Float64Array): void {
  let max = -Infinity;
  for (const x of v) max = Math.max(max, x);
  let sum = 0;
  for (let c = 0; c < v.length; c++) {
    v[c] = Math.exp(v[c] - max);
    sum += v[c];
  }
  for (let c = 0; c < v.length; c++) v[c] /= sum;
}

/** θ [logits, d + 1] of a model [d, k]; the two-class form keeps the difference class 1 − class 0. */
function fromModel(model: LinearModel, logits: number): Float64Array {
  const { d, k, weights, intercept } = model;
  const stride = d + 1;
  const theta = new Float64Array(logits * stride);
  for (let c = 0; c < logits; c++) {
    for (let j = 0; j < d; j++) theta[c * stride + j] = logits === 1 ? weights[j * k + 1] - weights[j * k] : weights[j * k + c];
    theta[c * stride + d] = logits === 1 ? intercept[1] - intercept[0] : intercept[c];
  }
  return theta;
}

/** The model [d, classCount] of θ; the two-class form becomes the symmetric pair −u/2, u/2. */
function toModel(theta: Float64Array, d: number, classCount: number): LinearModel {
  const stride = d + 1;
  const weights = new Float64Array(d * classCount);
  const intercept = new Float64Array(classCount);
  for (let c = 0; c < classCount; c++) {
    const [row, sign] = classCount === 2 ? [0, c === 0 ? -0.5 : 0.5] : [c, 1];
    for (let j = 0; j < d; j++) weights[j * classCount + c] = sign * theta[row * stride + j];
    intercept[c] = sign * theta[row * stride + d];
  }
  return { d, k: classCount, weights, intercept };
}

/** The class with the largest score in each row (the first on ties). */
export function argmaxRows(scores: Float64Array, n: number, k: number): Int32Array {
  const out = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let best = 0;
    for (let c = 1; c < k; c++) if (scores[i * k + c] > scores[i * k + best]) best = c;
    out[i] = best;
  }
  return out;
}

/** Share of rows whose predicted class equals the label; NaN for no rows. */
export function accuracy(predicted: Int32Array, classes: Int32Array): number {
  if (classes.length === 0) return NaN;
  let right = 0;
  for (let i = 0; i < classes.length; i++) if (predicted[i] === classes[i]) right++;
  return right / classes.length;
}
