import * as tf from '@tensorflow/tfjs-core';
import type { Rng } from '../random.js';
import { batchOf, takeRows, type ExampleTensors } from './batches.js';
import type { ExampleSet } from './examples.js';
import { rateRepresentation, type Representation } from './extractor.js';
import { spikingInit } from './init.js';
import { poissonSpikes, rowStream } from './input-coding.js';
import type { Matrix } from './matrix.js';
import { createTower, disposeTower, layerWidth, type Tower, type TowerShape } from './network.js';
import type { RuleDefinition } from './rule-definition.js';
import { ruleGradients, towerOutputs, trueGradients, type Batch, type LossOfOutputs, type RuleState } from './rules.js';
import { layerFiring } from './spiking-activity.js';
import { spikingForward, spikingDynamics, spikingRates, readsHeldInput, type SpikingDynamics } from './spiking-network.js';
import { spikingPass, spikingRule } from './spiking-rules.js';
import type { EncoderKindName, LayerFiring, LearnerSpec, SpikingEncoderSpec } from './spec.js';
import { towerStreams, trainingSpikeStream } from './streams.js';

/** Training batches draw fresh input spikes; evaluation gives each row the spikes of its own stream. */
export type BatchUse = 'train' | 'evaluate';

/** How the trainer builds, runs and trains the towers of one encoder kind. */
export interface EncoderKind {
  /** Tower `index` of the objective (0 encodes the learner's input), weights from the seed. */
  createTower(shape: TowerShape, index: number): Tower;
  /** The loss and a rule's update of every variable, for towers of this kind (rules.ts's ruleGradients with the kind's pass). */
  gradients(rule: RuleDefinition, towers: readonly Tower[], state: RuleState, batch: Batch, loss: LossOfOutputs): { loss: tf.Scalar; grads: tf.Tensor[] };
  /** The gradient the rule's update is compared with in the alignment angles. */
  reference(towers: readonly Tower[], batch: Batch, loss: LossOfOutputs): { loss: tf.Scalar; grads: tf.Tensor[] };
  /** Rows of a split as the towers read them (call inside tf.tidy). */
  batch(split: ExampleTensors, rows: Int32Array, use: BatchUse): Batch;
  /** Head outputs of every tower (the action goes to tower 0's head). */
  outputs(towers: readonly Tower[], batch: Batch): tf.Tensor2D[];
  /** A trained tower without head as the probes read it. */
  representation(tower: Tower): Representation;
  /** Spiking kinds: the activity of tower 0's hidden layers on a split. */
  firing?(tower: Tower, examples: ExampleSet): LayerFiring;
}

/** An MLP of rate units: rules run with RATE_PASS, exact gradients by autodiff. */
function mlpKind(spec: LearnerSpec, seed: number): EncoderKind {
  if (spec.encoder.kind === 'spiking') throw new Error('expected an MLP encoder');
  const { activation } = spec.encoder;
  return {
    createTower: (shape, index) => createTower(shape, activation, towerStreams(seed, shape, activation, index)),
    gradients: (rule, towers, state, batch, loss) => ruleGradients(rule, towers, state, batch, loss),
    reference: trueGradients,
    batch: (split, rows) => batchOf(split, rows),
    outputs: towerOutputs,
    representation: rateRepresentation,
  };
}

/**
 * Leaky integrate-and-fire layers (lif.ts) trained through time with a surrogate derivative;
 * the alignment angles compare a rule's update with backprop through time's.
 */
function spikingKind(spec: LearnerSpec, seed: number): EncoderKind {
  if (spec.encoder.kind !== 'spiking') throw new Error('expected a spiking encoder');
  const d = spikingDynamics(spec.encoder);
  const exact = spikingRule('backprop', d);
  const pass = spikingPass(d);
  const input = towerInput(spec.encoder, d, seed);
  return {
    createTower: (shape, index) => {
      const t = createTower(shape, null, towerStreams(seed, shape, 'spiking', index), spikingInit((layer) => readsHeldInput(layer, d)));
      // Each unit starts at its rheobase: with no input its membrane rises towards θ, so any excitation fires it.
      t.encoder.forEach((l) => tf.tidy(() => l.b.assign(tf.fill(l.b.shape, d.lif.threshold))));
      return t;
    },
    gradients: (rule, towers, state, batch, loss) => ruleGradients(rule, towers, state, batch, loss, pass),
    reference: (towers, batch, loss) => exact.gradients(towers, towers.map(() => []), batch, loss),
    batch(split, rows, use) {
      return { ...batchOf(split, rows, false), inputs: split.examples.inputs.map((m) => input(m, rows, use)) };
    },
    outputs: (towers, batch) => towers.map((t, i) => spikingForward(t, batch.inputs[i], i === 0 ? batch.extra : null, d).output),
    representation: (tower) => ({
      featureSize: layerWidth(tower.encoder[tower.encoder.length - 1]),
      features: (x, rows, cols) => spikingRates(tower, input({ rows, cols, data: x }, null, 'evaluate'), d),
      dispose: () => disposeTower(tower),
    }),
    firing: (tower, examples) => {
      const m = examples.inputs[0];
      return layerFiring(tower, m.rows, (start, end) => input(m, Int32Array.from({ length: end - start }, (_, i) => start + i), 'evaluate'), d);
    },
  };
}

/**
 * The tower input of some rows of a standardised matrix (all rows when `rows` is null):
 * current coding uploads the rows themselves, held over the steps; rate coding uploads their
 * Bernoulli spike trains ([steps·rows, cols]).
 */
function towerInput(spec: SpikingEncoderSpec, d: SpikingDynamics, seed: number): (m: Matrix, rows: Int32Array | null, use: BatchUse) => tf.Tensor2D {
  const training: Rng = trainingSpikeStream(seed);
  return (m, rows, use) => {
    const x = rows == null ? m.data : takeRows(m, rows);
    const n = rows == null ? m.rows : rows.length;
    if (spec.inputCoding === 'current') return tf.tensor2d(x, [n, m.cols]);
    const streams = use === 'train' ? () => training : rowStream(seed, x, m.cols);
    return tf.tensor2d(poissonSpikes(x, n, m.cols, d.lif.steps, streams), [d.lif.steps * n, m.cols]);
  };
}

/** Every encoder kind by its config name (the names are ENCODER_KINDS in spec.ts). */
export const ENCODER_KIND_REGISTRY: Record<EncoderKindName, (spec: LearnerSpec, seed: number) => EncoderKind> = {
  mlp: mlpKind,
  spiking: spikingKind,
};

/** The encoder kind of a learner, bound to its seed. */
export function encoderKind(spec: LearnerSpec, seed: number): EncoderKind {
  return ENCODER_KIND_REGISTRY[spec.encoder.kind ?? 'mlp'](spec, seed);
}
