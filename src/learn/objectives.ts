import type { Tensor1D, Tensor2D } from '@tensorflow/tfjs-core';
import { LATENT_KIND } from '../collect/dataset.js';
import { nextSteps } from './examples.js';
import { infoNce, meanSquaredError, softmaxCrossEntropy } from './losses.js';
import { channelWidth } from './matrix.js';
import type { ObjectiveDefinition } from './objective-definition.js';
import { OBJECTIVE_TARGET, type LearnerSpec, type ObjectiveName } from './spec.js';
import { spikingProblems } from './spiking-checks.js';

// The built-in objectives, each in the shape a plug-in file default-exports
// (objective-definition.ts). Inputs and targets are standardised with the training split's
// statistics, so every loss is on a comparable scale.

function mse(outputs: readonly Tensor2D[], target: Tensor2D | null) {
  if (target == null) throw new Error('mean squared error needs a target');
  return meanSquaredError(outputs[0], target);
}

/** `input` → `target` channels at the same step (offset 0) or the next (offset 1), by mean squared error. */
export const predict: ObjectiveDefinition = {
  type: 'objective',
  name: 'predict',
  description: 'predict the target channels from the input channels, at the same step or the next',
  target: OBJECTIVE_TARGET.predict,
  setup: ({ learner, channelSize }) => ({
    towers: [{ channels: learner.input, outputs: channelWidth(channelSize, learner.target) }],
    signal: {
      examples(source, steps) {
        const rows = learner.offset === 1 ? source.withNext(steps) : steps;
        const targetRows = learner.offset === 1 ? nextSteps(rows) : rows;
        return { n: rows.length, inputs: [source.standardised(learner.input, rows)], target: source.standardised(learner.target, targetRows) };
      },
      loss: mse,
    },
  }),
};

/** An autoencoder: the standardised input itself is the target. */
export const reconstruct: ObjectiveDefinition = {
  type: 'objective',
  name: 'reconstruct',
  description: 'reproduce its own input (a single-sense autoencoder)',
  target: OBJECTIVE_TARGET.reconstruct,
  setup: ({ learner, channelSize }) => ({
    towers: [{ channels: learner.input, outputs: channelWidth(channelSize, learner.input) }],
    signal: {
      examples(source, steps) {
        const x = source.standardised(learner.input, steps);
        return { n: steps.length, inputs: [x], target: x };
      },
      loss: mse,
    },
  }),
};

/**
 * The standardised input at t + 1 from the representation at t and the action taken
 * between t and t + 1. The motor channel is the efference copy of the action that led
 * *into* a step, so that action is motor row t + 1. It enters the linear head, not the
 * encoder, so the representation stays a function of the input alone, like every other
 * learner's.
 */
export const forecast: ObjectiveDefinition = {
  type: 'objective',
  name: 'forecast',
  description: 'predict its own input at the next step from this step\'s input and the action taken',
  target: OBJECTIVE_TARGET.forecast,
  setup: ({ learner, channelSize }) => ({
    towers: [{ channels: learner.input, outputs: channelWidth(channelSize, learner.input), extra: channelSize.motor }],
    signal: {
      examples(source, steps) {
        const rows = source.withNext(steps);
        const next = nextSteps(rows);
        return {
          n: rows.length,
          inputs: [source.standardised(learner.input, rows)],
          extra: source.raw(['motor'], next),
          target: source.standardised(learner.input, next),
        };
      },
      loss: mse,
    },
  }),
};

/**
 * InfoNCE between the input encoder's embedding and a second encoder's embedding of the
 * `target` channels at the same step. Both towers have the learner's hidden sizes; each
 * linear head projects to an embedding as wide as the last hidden layer.
 */
export const contrast: ObjectiveDefinition = {
  type: 'objective',
  name: 'contrast',
  description: 'align its embedding with a second encoder\'s embedding of the target channels (InfoNCE)',
  target: OBJECTIVE_TARGET.contrast,
  minBatch: 2, // InfoNCE needs at least one negative
  setup: ({ learner }) => {
    const embedding = learner.encoder.hidden[learner.encoder.hidden.length - 1];
    return {
      towers: [{ channels: learner.input, outputs: embedding }, { channels: learner.target, outputs: embedding }],
      signal: {
        examples: (source, steps) => ({
          n: steps.length,
          inputs: [source.standardised(learner.input, steps), source.standardised(learner.target, steps)],
        }),
        loss: (outputs) => infoNce(outputs[0], outputs[1], learner.train.temperature),
      },
    };
  },
};

/**
 * The latents directly: continuous ones standardised and fitted by MSE, categorical ones
 * by softmax cross-entropy over their logits; the loss is the mean over latents. The target
 * matrix holds one column per latent (a value, or a class index).
 */
export const supervised: ObjectiveDefinition = {
  type: 'objective',
  name: 'supervised',
  description: 'predict the latent targets directly (an upper bound, not self-supervised)',
  target: OBJECTIVE_TARGET.supervised,
  setup: ({ tf, learner, classCount }) => {
    const names = learner.supervisedTargets;
    if (names.length === 0) throw new Error(`learner '${learner.name}': objective 'supervised' needs at least one latent target`);
    const widths = names.map((name) => (LATENT_KIND[name] === 'continuous' ? 1 : classCount(name)));
    const offsets = widths.map((_, j) => widths.slice(0, j).reduce((a, b) => a + b, 0));
    return {
      towers: [{ channels: learner.input, outputs: widths.reduce((a, b) => a + b, 0) }],
      signal: {
        examples: (source, steps) => ({
          n: steps.length,
          inputs: [source.standardised(learner.input, steps)],
          target: { rows: steps.length, cols: names.length, data: latentColumns(names.map((name) => source.latent(name, steps)), steps.length) },
        }),
        loss(outputs, target) {
          if (target == null) throw new Error('supervised loss needs a target');
          const losses = names.map((name, j) => {
            const part = tf.slice(outputs[0], [0, offsets[j]], [-1, widths[j]]); // [batch, width_j]
            const column = tf.slice(target, [0, j], [-1, 1]); // [batch, 1]
            return LATENT_KIND[name] === 'continuous'
              ? meanSquaredError(part, column)
              : softmaxCrossEntropy(part, tf.reshape(column, [-1]) as Tensor1D);
          });
          return tf.div(tf.addN(losses), losses.length);
        },
      },
    };
  },
};

/** Columns side by side, [n, columns.length]. */
function latentColumns(columns: readonly Float32Array[], n: number): Float32Array {
  const out = new Float32Array(n * columns.length);
  columns.forEach((column, j) => column.forEach((value, i) => { out[i * columns.length + j] = value; }));
  return out;
}

/** Frozen random weights: an encoder with no head and nothing to train (the floor). */
export const untrained: ObjectiveDefinition = {
  type: 'objective',
  name: 'untrained',
  description: 'nothing: frozen random weights (the floor)',
  target: OBJECTIVE_TARGET.untrained,
  setup: ({ learner }) => ({ towers: [{ channels: learner.input, outputs: 0 }], signal: null }),
};

/** Every built-in objective by its config name. */
export const OBJECTIVE_REGISTRY: Record<ObjectiveName, ObjectiveDefinition> = {
  predict, reconstruct, forecast, contrast, supervised, untrained,
};

/** Rejects a spec that lacks what its objective or its training needs, naming the learner. */
export function checkSpec(spec: LearnerSpec, objective: ObjectiveDefinition): void {
  const fail = (why: string): never => { throw new Error(`learner '${spec.name}': ${why}`); };
  if (spec.input.length === 0) fail('needs at least one input channel');
  if (spec.encoder.hidden.length === 0) fail('encoder needs at least one hidden layer (its last is the representation)');
  if (spec.encoder.hidden.some((w) => !Number.isInteger(w) || w < 1)) fail(`hidden sizes must be positive integers, got [${spec.encoder.hidden.join(', ')}]`);
  if (objective.target === 'required' && spec.target.length === 0) fail(`objective '${objective.name}' needs at least one target channel`);
  if (!(spec.train.batch >= 1) || !Number.isInteger(spec.train.batch)) fail(`batch must be a positive integer, got ${spec.train.batch}`);
  if (!Number.isInteger(spec.train.patience) || spec.train.patience < 1) fail(`patience must be a positive integer, got ${spec.train.patience}`);
  if (!(spec.train.learningRate > 0)) fail(`learning rate must be positive, got ${spec.train.learningRate}`);
  if (!(spec.train.temperature > 0)) fail(`temperature must be positive, got ${spec.train.temperature}`);
  if (spec.encoder.kind === 'spiking') {
    const [first] = spikingProblems(spec.encoder, spec.rule);
    if (first != null) fail(`${first.key.join('.')}: ${first.message}`);
  }
}
