import * as tf from '@tensorflow/tfjs-core';

/**
 * The loss of every batch of a pass, kept on the device and read once at the end, so no
 * training step waits for a read-back.
 */
export class BatchLosses {
  private losses: tf.Scalar[] = [];
  private readonly rows: number[] = [];

  /** Takes ownership of a batch's loss. */
  add(loss: tf.Scalar, rows: number): void {
    this.losses.push(loss);
    this.rows.push(rows);
  }

  /** Rows added so far. */
  get count(): number {
    return this.rows.reduce((a, b) => a + b, 0);
  }

  /**
   * Reads every loss and frees the tensors: the example-weighted mean Σ loss_b·rows_b / Σ rows_b
   * (summed in float64, batch by batch) and the first non-finite batch loss, if any.
   */
  read(): { mean: number; firstNonFinite: number | null } {
    const values = this.losses.length === 0 ? new Float32Array(0) : tf.tidy(() => tf.stack(this.losses).dataSync());
    this.dispose();
    let sum = 0;
    let count = 0;
    let firstNonFinite: number | null = null;
    values.forEach((value, i) => {
      if (firstNonFinite == null && !Number.isFinite(value)) firstNonFinite = value;
      sum += value * this.rows[i];
      count += this.rows[i];
    });
    return { mean: sum / count, firstNonFinite };
  }

  /** Frees the losses not yet read. */
  dispose(): void {
    tf.dispose(this.losses);
    this.losses = [];
  }
}
