import * as tf from '@tensorflow/tfjs-core';
import { classCount, LATENT_KIND, type Dataset, type LatentName } from '../collect/dataset.js';
import type { ChannelName } from '../senses/channel.js';
import { nextSteps, type ExampleSet, type TrainingStatistics } from './examples.js';
import { infoNce, meanSquaredError, softmaxCrossEntropy } from './losses.js';
import { channelWidth, datasetRows, orderedChannels, withSuccessor } from './matrix.js';
import type { TowerShape } from './network.js';
import type { LearnerSpec, ObjectiveName } from './spec.js';
import { spikingProblems } from './spiking-checks.js';

/** How an objective trains: its examples and its loss. */
export interface TrainingSignal {
  examples(stats: TrainingStatistics, steps: Int32Array): ExampleSet;
  /** Scalar loss from the towers' head outputs (one per tower) and the batch target. */
  loss(outputs: readonly tf.Tensor2D[], target: tf.Tensor2D | null): tf.Scalar;
}

/** An objective bound to one learner and dataset. */
export interface Objective {
  /** Tower 0 always encodes `spec.input`; its encoder is the learner's representation. */
  readonly towers: readonly TowerShape[];
  /** null for `untrained`, whose weights stay at their initial values. */
  readonly signal: TrainingSignal | null;
}

type ObjectiveFactory = (spec: LearnerSpec, data: Dataset) => Objective;

function tower(spec: LearnerSpec, data: Dataset, channels: readonly ChannelName[], outputWidth: number, extraWidth = 0): TowerShape {
  return { channels: orderedChannels(channels), inputWidth: channelWidth(data.channelSize, channels), hidden: spec.encoder.hidden, outputWidth, extraWidth };
}

function mse(outputs: readonly tf.Tensor2D[], target: tf.Tensor2D | null): tf.Scalar {
  if (target == null) throw new Error('mean squared error needs a target');
  return meanSquaredError(outputs[0], target);
}

/** `input` → `target` channels at the same step (offset 0) or the next (offset 1), standardised. */
const predict: ObjectiveFactory = (spec, data) => ({
  towers: [tower(spec, data, spec.input, channelWidth(data.channelSize, spec.target))],
  signal: {
    examples(stats, steps) {
      const rows = spec.offset === 1 ? withSuccessor(data, steps) : steps;
      const targetRows = spec.offset === 1 ? nextSteps(rows) : rows;
      return {
        n: rows.length,
        inputs: [stats.standardised(spec.input, rows)],
        extra: null,
        target: stats.standardised(spec.target, targetRows),
      };
    },
    loss: mse,
  },
});

/** An autoencoder: the standardised input itself is the target. */
const reconstruct: ObjectiveFactory = (spec, data) => {
  const width = channelWidth(data.channelSize, spec.input);
  return {
    towers: [tower(spec, data, spec.input, width)],
    signal: {
      examples(stats, steps) {
        const x = stats.standardised(spec.input, steps);
        return { n: steps.length, inputs: [x], extra: null, target: x };
      },
      loss: mse,
    },
  };
};

/**
 * The standardised input at t + 1 from the representation at t and the action taken
 * between t and t + 1. The motor channel is the efference copy of the action that led
 * *into* a step, so that action is motor row t + 1. It enters the linear head, not the
 * encoder, so the representation stays a function of the input alone, like every other
 * learner's.
 */
const forecast: ObjectiveFactory = (spec, data) => {
  const width = channelWidth(data.channelSize, spec.input);
  return {
    towers: [tower(spec, data, spec.input, width, data.channelSize.motor)],
    signal: {
      examples(stats, steps) {
        const rows = withSuccessor(data, steps);
        const next = nextSteps(rows);
        return {
          n: rows.length,
          inputs: [stats.standardised(spec.input, rows)],
          extra: datasetRows(data, ['motor'], next),
          target: stats.standardised(spec.input, next),
        };
      },
      loss: mse,
    },
  };
};

/**
 * InfoNCE between the input encoder's embedding and a second encoder's embedding of the
 * `target` channels at the same step. Both towers have the learner's hidden sizes; each
 * linear head projects to an embedding as wide as the last hidden layer.
 */
const contrast: ObjectiveFactory = (spec, data) => {
  const embedding = spec.encoder.hidden[spec.encoder.hidden.length - 1];
  return {
    towers: [
      tower(spec, data, spec.input, embedding),
      tower(spec, data, spec.target, embedding),
    ],
    signal: {
      examples: (stats, steps) => ({
        n: steps.length,
        inputs: [stats.standardised(spec.input, steps), stats.standardised(spec.target, steps)],
        extra: null,
        target: null,
      }),
      loss: (outputs) => infoNce(outputs[0], outputs[1], spec.train.temperature),
    },
  };
};

/** Output columns of one latent: 1 for a continuous one, its class count for a categorical one. */
function latentWidth(data: Dataset, name: LatentName): number {
  return LATENT_KIND[name] === 'continuous' ? 1 : classCount(data, name);
}

/** One target column per latent: standardised value (continuous) or class index (categorical). [n, latents] */
function latentTargets(stats: TrainingStatistics, names: readonly LatentName[], steps: Int32Array): Float32Array {
  const target = new Float32Array(steps.length * names.length);
  names.forEach((name, j) => {
    const s = LATENT_KIND[name] === 'continuous' ? stats.latent(name) : { mean: [0], std: [1] };
    const values = stats.data.latents[name];
    steps.forEach((t, i) => { target[i * names.length + j] = (values[t] - s.mean[0]) / s.std[0]; });
  });
  return target;
}

/**
 * The latents directly: continuous ones standardised and fitted by MSE, categorical ones
 * by softmax cross-entropy over their logits; the loss is the mean over latents.
 */
const supervised: ObjectiveFactory = (spec, data) => {
  const names = spec.supervisedTargets;
  const widths = names.map((name) => latentWidth(data, name));
  const offsets = widths.map((_, j) => widths.slice(0, j).reduce((a, b) => a + b, 0));
  return {
    towers: [tower(spec, data, spec.input, widths.reduce((a, b) => a + b, 0))],
    signal: {
      examples: (stats, steps) => ({
        n: steps.length,
        inputs: [stats.standardised(spec.input, steps)],
        extra: null,
        target: { rows: steps.length, cols: names.length, data: latentTargets(stats, names, steps) },
      }),
      loss(outputs, target) {
        if (target == null) throw new Error('supervised loss needs a target');
        const losses = names.map((name, j) => {
          const part = tf.slice(outputs[0], [0, offsets[j]], [-1, widths[j]]); // [batch, width_j]
          const column = tf.slice(target, [0, j], [-1, 1]); // [batch, 1]
          return LATENT_KIND[name] === 'continuous'
            ? meanSquaredError(part, column)
            : softmaxCrossEntropy(part, tf.reshape(column, [-1]) as tf.Tensor1D);
        });
        return tf.div(tf.addN(losses), losses.length);
      },
    },
  };
};

/** Frozen random weights: an encoder with no head and nothing to train (the floor). */
const untrained: ObjectiveFactory = (spec, data) => ({
  towers: [tower(spec, data, spec.input, 0)],
  signal: null,
});

/** Every objective by its config name. */
export const OBJECTIVE_REGISTRY: Record<ObjectiveName, ObjectiveFactory> = {
  predict, reconstruct, forecast, contrast, supervised, untrained,
};

/** Rejects a spec whose objective lacks what it needs, naming the learner. */
export function checkSpec(spec: LearnerSpec): void {
  const fail = (why: string): never => { throw new Error(`learner '${spec.name}': ${why}`); };
  if (spec.input.length === 0) fail('needs at least one input channel');
  if (spec.encoder.hidden.length === 0) fail('encoder needs at least one hidden layer (its last is the representation)');
  if (spec.encoder.hidden.some((w) => !Number.isInteger(w) || w < 1)) fail(`hidden sizes must be positive integers, got [${spec.encoder.hidden.join(', ')}]`);
  if ((spec.objective === 'predict' || spec.objective === 'contrast') && spec.target.length === 0) {
    fail(`objective '${spec.objective}' needs at least one target channel`);
  }
  if (spec.objective === 'supervised' && spec.supervisedTargets.length === 0) fail("objective 'supervised' needs at least one latent target");
  if (!(spec.train.batch >= 1) || !Number.isInteger(spec.train.batch)) fail(`batch must be a positive integer, got ${spec.train.batch}`);
  if (!Number.isInteger(spec.train.patience) || spec.train.patience < 1) fail(`patience must be a positive integer, got ${spec.train.patience}`);
  if (!(spec.train.learningRate > 0)) fail(`learning rate must be positive, got ${spec.train.learningRate}`);
  if (!(spec.train.temperature > 0)) fail(`temperature must be positive, got ${spec.train.temperature}`);
  if (spec.encoder.kind === 'spiking') {
    const [first] = spikingProblems(spec.encoder, spec.rule);
    if (first != null) fail(`${first.key.join('.')}: ${first.message}`);
  }
}
