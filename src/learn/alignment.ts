import * as tf from '@tensorflow/tfjs-core';

/** Angle in degrees between two tensors read as vectors, acos(⟨u, g⟩ / (‖u‖‖g‖)); NaN when either is all zeros. */
export function angleDeg(u: tf.Tensor, g: tf.Tensor): tf.Scalar {
  const cos = tf.div(tf.sum(tf.mul(u, g)), tf.mul(tf.norm(u), tf.norm(g)));
  return tf.mul(tf.acos(tf.clipByValue(cos, -1, 1)), 180 / Math.PI);
}

/**
 * Per weight matrix, the weight-update angle: between the rule's update of that matrix and the
 * true gradient of the loss with respect to it (0° is backprop's direction, 90° an unrelated
 * one). It is not the angle between hidden-unit updates, Δh_FA against Δh_BP, that Lillicrap et
 * al. 2016 plot. Both lists hold one tensor per variable, W then b per layer; biases are skipped.
 */
export function weightAngles(ruleGrads: readonly tf.Tensor[], trueGrads: readonly tf.Tensor[]): number[] {
  return tf.tidy(() => {
    const angles = ruleGrads.filter((_, i) => i % 2 === 0).map((u, j) => angleDeg(u, trueGrads[2 * j]));
    return Array.from(tf.stack(angles).dataSync());
  });
}

/** Running per-layer means of recorded angles (NaN records, from all-zero updates, are skipped). */
export class AngleAverage {
  private sums: number[] = [];
  private counts: number[] = [];

  add(angles: readonly number[]): void {
    angles.forEach((a, i) => {
      this.sums[i] = (this.sums[i] ?? 0) + (Number.isNaN(a) ? 0 : a);
      this.counts[i] = (this.counts[i] ?? 0) + (Number.isNaN(a) ? 0 : 1);
    });
  }

  get recorded(): boolean {
    return this.sums.length > 0;
  }

  means(): number[] {
    return this.sums.map((s, i) => (this.counts[i] > 0 ? s / this.counts[i] : Number.NaN));
  }
}
