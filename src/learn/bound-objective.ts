import * as tf from '@tensorflow/tfjs-core';
import { classCount, type Dataset } from '../collect/dataset.js';
import { CHANNELS } from '../senses/channel.js';
import type { ExampleSet, ExampleSource, ObjectiveDefinition, TowerPlan, TrainingSignal } from './objective-definition.js';
import { channelWidth, orderedChannels, type Matrix } from './matrix.js';
import type { TowerShape } from './network.js';
import type { LearnerSpec } from './spec.js';

/** An objective set up for one learner and dataset, its answers checked. */
export interface BoundObjective {
  readonly name: string;
  /** Tower 0 encodes `spec.input`; its encoder is the learner's representation. */
  readonly towers: readonly TowerShape[];
  /** null when nothing is trained (the initial weights stay). */
  readonly signal: TrainingSignal | null;
  /** Fewest rows a batch needs. */
  readonly minBatch: number;
}

/** Sets an objective up for a learner and a dataset and checks the towers it asks for. */
export function bindObjective(definition: ObjectiveDefinition, spec: LearnerSpec, data: Dataset): BoundObjective {
  const fail = (why: string): never => { throw new Error(`objective '${definition.name}': ${why}`); };
  const setup = definition.setup({ tf, learner: spec, channelSize: data.channelSize, classCount: (name) => classCount(data, name) });
  const plans: unknown = setup?.towers;
  if (!Array.isArray(plans) || plans.length === 0) fail('setup must return at least one tower');
  const towers = (plans as TowerPlan[]).map((plan, i) => towerShape(plan, i, spec, data, fail));
  const input = orderedChannels(spec.input);
  if (towers[0].channels.join('+') !== input.join('+')) fail(`tower 0 must read the learner's input [${input.join(', ')}], got [${towers[0].channels.join(', ')}]`);
  const signal = setup.signal;
  if (signal != null && (typeof signal.examples !== 'function' || typeof signal.loss !== 'function')) fail('signal must have examples and loss functions, or be null');
  if (signal != null && towers.some((t) => t.outputWidth === 0)) fail('every tower needs outputs > 0 when there is a signal to train');
  const minBatch = definition.minBatch ?? 1;
  if (!Number.isInteger(minBatch) || minBatch < 1) fail(`minBatch must be a whole number ≥ 1, got ${minBatch}`);
  return { name: definition.name, towers, signal, minBatch };
}

function towerShape(plan: TowerPlan, i: number, spec: LearnerSpec, data: Dataset, fail: (why: string) => never): TowerShape {
  const channels = plan?.channels;
  if (!Array.isArray(channels) || channels.length === 0 || channels.some((c) => !(CHANNELS as readonly string[]).includes(c))) {
    fail(`tower ${i} must read a non-empty list of channels (${CHANNELS.join(', ')})`);
  }
  const extra = plan.extra ?? 0;
  if (!Number.isInteger(plan.outputs) || plan.outputs < 0) fail(`tower ${i}: outputs must be a whole number ≥ 0, got ${plan.outputs}`);
  if (!Number.isInteger(extra) || extra < 0 || (i > 0 && extra > 0)) fail(`tower ${i}: extra must be a whole number ≥ 0, and only tower 0 has extra head inputs`);
  return { channels: orderedChannels(channels), inputWidth: channelWidth(data.channelSize, channels), hidden: spec.encoder.hidden, outputWidth: plan.outputs, extraWidth: extra };
}

/** A split's examples from the objective, checked against its towers; a missing extra or target becomes null. */
export function splitExamples(objective: BoundObjective, source: ExampleSource, steps: Int32Array): ExampleSet {
  const fail = (why: string): never => { throw new Error(`objective '${objective.name}': examples: ${why}`); };
  const e = objective.signal!.examples(source, steps);
  if (e == null || !Number.isInteger(e.n) || e.n < 0) fail('n must be a whole number ≥ 0');
  const check = (m: Matrix | null | undefined, what: string, cols: number | null) => {
    if (m == null) return;
    if (!(m.data instanceof Float32Array) || m.rows !== e.n || (cols != null && m.cols !== cols) || m.data.length !== m.rows * m.cols) {
      fail(`${what} must be a matrix of ${e.n} rows${cols == null ? '' : ` × ${cols} columns`} ({ rows, cols, data: Float32Array })`);
    }
  };
  if (!Array.isArray(e.inputs) || e.inputs.length !== objective.towers.length) fail(`inputs must hold one matrix per tower (${objective.towers.length})`);
  e.inputs.forEach((m, i) => {
    if (m == null) fail(`inputs[${i}] is missing`);
    check(m, `inputs[${i}]`, objective.towers[i].inputWidth);
  });
  check(e.extra, 'extra', objective.towers[0].extraWidth);
  if (objective.towers[0].extraWidth > 0 && e.extra == null) fail(`extra must hold the ${objective.towers[0].extraWidth} extra head columns of tower 0`);
  check(e.target, 'target', null);
  return { n: e.n, inputs: e.inputs, extra: e.extra ?? null, target: e.target ?? null };
}

/** The objective's loss of a batch, which must be a scalar tensor. */
export function batchLoss(objective: BoundObjective, outputs: readonly tf.Tensor2D[], target: tf.Tensor2D | null): tf.Scalar {
  const loss = objective.signal!.loss(outputs, target);
  if (!(loss instanceof tf.Tensor) || loss.rank !== 0) throw new Error(`objective '${objective.name}': loss must return a scalar tensor`);
  return loss;
}
