import * as tf from '@tensorflow/tfjs-core';
import { transposeLast } from './plain-matmul.js';
import { meanSquaredDifference } from './squared-error.js';

/** Mean squared error over every element: mean((o − y)²) (its gradient in one kernel, squared-error.ts). */
export function meanSquaredError(output: tf.Tensor2D, target: tf.Tensor2D): tf.Scalar {
  return meanSquaredDifference(output, target);
}

/** Softmax cross-entropy, −mean_i log softmax(logits_i)[label_i]; labels are class indices. */
export function softmaxCrossEntropy(logits: tf.Tensor2D, labels: tf.Tensor1D): tf.Scalar {
  const classes = logits.shape[1];
  const oneHot = tf.oneHot(tf.cast(labels, 'int32'), classes);
  return tf.neg(tf.mean(tf.sum(tf.mul(oneHot, tf.logSoftmax(logits)), 1)));
}

/** Rows scaled to unit length (a small epsilon keeps all-zero rows finite). */
export function l2Normalise(z: tf.Tensor2D): tf.Tensor2D {
  return tf.div(z, tf.sqrt(tf.add(tf.sum(tf.square(z), 1, true), 1e-12)));
}

/**
 * Symmetric InfoNCE between two batches of embeddings paired row by row.
 *
 * InfoNCE (van den Oord et al. 2018, eq. 4) with the critic exp(cos(a_i, b_j) / τ): row i's
 * positive is b_i and the other rows of the batch are its negatives. We average both
 * directions, a→b over rows and b→a over columns (as in Radford et al. 2021), so neither
 * encoder is only a "key" encoder. For unrelated embeddings the loss is ≈ log N, and
 * log N − loss lower-bounds the mutual information between the paired views.
 */
export function infoNce(za: tf.Tensor2D, zb: tf.Tensor2D, temperature: number): tf.Scalar {
  const n = za.shape[0];
  const logits = tf.div(tf.matMul(l2Normalise(za), transposeLast(l2Normalise(zb))), temperature); // [n, n]
  const positives = tf.eye(n);
  const aToB = tf.neg(tf.mean(tf.sum(tf.mul(positives, tf.logSoftmax(logits, 1)), 1)));
  const bToA = tf.neg(tf.mean(tf.sum(tf.mul(positives, tf.logSoftmax(transposeLast(logits) as tf.Tensor2D, 1)), 1)));
  return tf.div(tf.add(aToB, bToA), 2);
}
