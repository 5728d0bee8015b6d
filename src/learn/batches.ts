import * as tf from '@tensorflow/tfjs-core';
import type { ExampleSet } from './examples.js';
import type { Matrix } from './matrix.js';
import type { Batch } from './rules.js';

/** Examples of one split uploaded once; batches are gathered from them by row index. */
export interface SplitTensors {
  readonly n: number;
  readonly inputs: tf.Tensor2D[];
  readonly extra: tf.Tensor2D | null;
  readonly target: tf.Tensor2D | null;
}

const upload = (m: Matrix): tf.Tensor2D => tf.tensor2d(m.data, [m.rows, m.cols]);

/** Copies a split's examples into tensors once per training run. */
export function uploadExamples(e: ExampleSet): SplitTensors {
  return {
    n: e.n,
    inputs: e.inputs.map(upload),
    extra: e.extra == null ? null : upload(e.extra),
    target: e.target == null ? null : upload(e.target),
  };
}

/** Frees a split's tensors. */
export function disposeSplit(s: SplitTensors): void {
  tf.dispose([...s.inputs, ...(s.extra == null ? [] : [s.extra]), ...(s.target == null ? [] : [s.target])]);
}

/** The rows of a split that form one mini-batch (call inside tf.tidy). */
export function gatherBatch(s: SplitTensors, rows: Int32Array): Batch {
  const index = tf.tensor1d(rows, 'int32');
  const pick = (t: tf.Tensor2D): tf.Tensor2D => tf.gather(t, index);
  return { inputs: s.inputs.map(pick), extra: s.extra == null ? null : pick(s.extra), target: s.target == null ? null : pick(s.target) };
}
