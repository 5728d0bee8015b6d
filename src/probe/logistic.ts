import type { LinearModel } from './ridge.js';

/**
 * When to stop: half the squared gradient in the preconditioner's metric (about the
 * remaining decrease of the mean cross-entropy, in nats) below 1e-6, far finer than
 * anything that moves an accuracy; or an iteration cap (common practice).
 */
const TOLERANCE = 1e-6;
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
 */
export function fitLogistic(
  z: Float64Array, // [n, d], centred on these rows
  classes: Int32Array, // [n], 0..classCount−1
  n: number,
  eigen: Float64Array, // [d], diag of ZᵀZ/n
  classCount: number,
  alpha: number,
  start?: LinearModel,
): LinearModel {
  const d = eigen.length;
  const K = classCount;
  if (n < 1 || z.length !== n * d || classes.length !== n) throw new Error(`fitLogistic: expected z ${n}×${d} and ${n} labels`);
  if (!(alpha > 0)) throw new Error(`logistic penalty α must be > 0, got ${alpha}`);
  const size = (d + 1) * K; // parameters: rows 0..d−1 weights, row d intercept
  const curvature = new Float64Array(d + 1);
  for (let j = 0; j < d; j++) curvature[j] = 0.5 * eigen[j] + alpha;
  curvature[d] = 0.5;
  let x = new Float64Array(size);
  if (start !== undefined) {
    x.set(start.weights);
    x.set(start.intercept, d * K);
  }
  const y = Float64Array.from(x);
  let theta = 1;
  const g = new Float64Array(size);
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    softmaxGradient(z, classes, n, d, K, alpha, y, g);
    const next = new Float64Array(size);
    let decrement = 0;
    let ascent = 0;
    for (let p = 0; p < size; p++) {
      const step = g[p] / curvature[Math.floor(p / K)];
      next[p] = y[p] - step;
      decrement += g[p] * step;
      ascent += g[p] * (next[p] - x[p]);
    }
    if (0.5 * decrement < TOLERANCE) {
      x = next;
      break;
    }
    const restart = ascent > 0;
    const thetaNext = restart ? 1 : (1 + Math.sqrt(1 + 4 * theta * theta)) / 2;
    const momentum = restart ? 0 : (theta - 1) / thetaNext;
    for (let p = 0; p < size; p++) y[p] = next[p] + momentum * (next[p] - x[p]);
    theta = thetaNext;
    x = next;
  }
  return { d, k: K, weights: x.slice(0, d * K), intercept: x.slice(d * K) };
}

/** Gradient of the penalised mean cross-entropy at params, written into g. */
function softmaxGradient(
  z: Float64Array, classes: Int32Array, n: number, d: number, K: number, alpha: number,
  params: Float64Array, g: Float64Array,
): void {
  g.fill(0);
  const residual = new Float64Array(K);
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < K; c++) residual[c] = params[d * K + c];
    for (let j = 0; j < d; j++) {
      const a = z[i * d + j];
      for (let c = 0; c < K; c++) residual[c] += a * params[j * K + c];
    }
    softmaxInPlace(residual);
    residual[classes[i]] -= 1; // p − onehot(y): the gradient of cross-entropy with respect to the logits
    for (let j = 0; j < d; j++) {
      const a = z[i * d + j] / n;
      for (let c = 0; c < K; c++) g[j * K + c] += a * residual[c];
    }
    for (let c = 0; c < K; c++) g[d * K + c] += residual[c] / n;
  }
  for (let p = 0; p < d * K; p++) g[p] += alpha * params[p];
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
