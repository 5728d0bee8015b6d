import * as tf from '@tensorflow/tfjs-core';
import { createRng, normal } from '../random.js';
import { createOptimizer, type Optimizer } from './optimizers.js';

/** The shape of a stacked-training measurement. */
export interface StackedWorkload {
  /** Same-shape models trained side by side. */
  readonly models: number;
  /** Layer widths from input to output, e.g. [160, 128, 128, 48]. */
  readonly widths: readonly number[];
  readonly batch: number;
  /** Training rows per model. */
  readonly rows: number;
  readonly epochs: number;
}

const swapLast = (x: tf.Tensor3D): tf.Tensor3D => tf.transpose(x, [0, 2, 1]);

/** One Adam step of every model at once; x is [models, batch, in], y [models, batch, out]. */
function stackedStep(W: tf.Variable[], b: tf.Variable[], x: tf.Tensor3D, y: tf.Tensor3D, adam: Optimizer): void {
  tf.tidy(() => {
    const post: tf.Tensor3D[] = [x];
    const pre: tf.Tensor3D[] = [];
    W.forEach((w, l) => {
      const a = tf.add(tf.matMul(post[l], w as tf.Tensor3D), b[l]) as tf.Tensor3D;
      pre.push(a);
      post.push(l < W.length - 1 ? tf.relu(a) : a);
    });
    const output = post[W.length];
    let delta = tf.mul(tf.sub(output, y), 2 / (y.shape[1] * y.shape[2])) as tf.Tensor3D; // ∂ mean((o − y)²) per model
    const grads: tf.Tensor[] = [];
    for (let l = W.length - 1; l >= 0; l--) {
      grads.unshift(tf.matMul(swapLast(post[l]), delta), tf.sum(delta, 1, true));
      if (l > 0) delta = tf.mul(tf.matMul(delta, swapLast(W[l] as tf.Tensor3D)), tf.step(pre[l - 1])) as tf.Tensor3D;
    }
    adam.applyGradients(W.flatMap((w, l) => [w, b[l]]), grads);
  });
}

/**
 * Seconds per epoch of `models` same-shape MLPs (relu, MSE, Adam) trained as one stacked
 * model: every weight is [models, in, out] and every product a batched matrix product, so
 * each kernel dispatch does the work of all the models. Inputs and targets are Gaussian
 * draws: this measures what stacking would pay (for `crosswise bench`); it is not a learner.
 */
export function stackedEpochSeconds(work: StackedWorkload, seed: number): number[] {
  const rng = createRng(seed, 'bench', 'stacked');
  const { models, widths, batch, rows } = work;
  const layers = widths.slice(1).map((out, l) => ({ in: widths[l], out }));
  const draw = (n: number) => Float32Array.from({ length: n }, () => normal(rng));
  // He-normal weights (He et al. 2015), as the encoders' relu layers start.
  const W = tf.tidy(() => layers.map((s) => tf.variable(tf.tensor3d(draw(models * s.in * s.out).map((v) => v * Math.sqrt(2 / s.in)), [models, s.in, s.out]))));
  const b = tf.tidy(() => layers.map((s) => tf.variable(tf.zeros([models, 1, s.out]))));
  const x = tf.tensor3d(draw(models * rows * widths[0]), [models, rows, widths[0]]);
  const y = tf.tensor3d(draw(models * rows * widths[widths.length - 1]), [models, rows, widths[widths.length - 1]]);
  const adam = createOptimizer({ optimizer: 'adam', learningRate: 1e-3 });
  try {
    const seconds: number[] = [];
    for (let epoch = 0; epoch < work.epochs; epoch++) {
      const started = performance.now();
      for (let start = 0; start + batch <= rows; start += batch) {
        tf.tidy(() => stackedStep(W, b, tf.slice(x, [0, start, 0], [models, batch, -1]), tf.slice(y, [0, start, 0], [models, batch, -1]), adam));
      }
      seconds.push((performance.now() - started) / 1000);
    }
    return seconds;
  } finally {
    adam.dispose();
    tf.dispose([...W, ...b, x, y]);
  }
}
