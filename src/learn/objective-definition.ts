import type * as tfCore from '@tensorflow/tfjs-core';
import type { LatentName } from '../collect/dataset.js';
import type { ChannelName } from '../senses/channel.js';
import type { Matrix } from './matrix.js';
import type { Tf } from './rule-definition.js';
import type { LearnerSpec, TargetUse } from './spec.js';

/** One encoder an objective trains: what it reads and what its linear head puts out. */
export interface TowerPlan {
  /** Channels its encoder reads (in any order; they are laid out in CHANNELS order). */
  readonly channels: readonly ChannelName[];
  /** Width of the head's output; 0 means no head (nothing to train). */
  readonly outputs: number;
  /** Columns appended to the representation before the head (tower 0 only: forecast's action). */
  readonly extra?: number;
}

/** Examples of one split: per row, an input per tower, optional extra head columns and a target. */
export interface ExampleSet {
  readonly n: number;
  /** One input matrix per tower, [n, width of its channels]. */
  readonly inputs: readonly Matrix[];
  /** Extra head input of tower 0, [n, extra]. */
  readonly extra?: Matrix | null;
  /** What the loss compares against, [n, any width]; left out when the loss needs none. */
  readonly target?: Matrix | null;
}

/** What an objective's examples may read of the collected data (statistics from the training split only). */
export interface ExampleSource {
  /** Rows of channels at the given steps, standardised per column, [steps, width] in CHANNELS order. */
  standardised(channels: readonly ChannelName[], steps: ArrayLike<number>): Matrix;
  /** Rows of channels at the given steps in physical units, [steps, width]. */
  raw(channels: readonly ChannelName[], steps: ArrayLike<number>): Matrix;
  /** The steps whose next step belongs to the same episode (real transitions t → t + 1). */
  withNext(steps: Int32Array): Int32Array;
  /** A latent at the given steps: continuous ones standardised, categorical ones as class indices 0, 1, …. */
  latent(name: LatentName, steps: ArrayLike<number>): Float32Array;
}

/** How an objective trains once set up: its examples and its loss. */
export interface TrainingSignal {
  /** The examples of a split's steps (called for the training and the validation split). */
  examples(source: ExampleSource, steps: Int32Array): ExampleSet;
  /** The scalar loss of a batch from each tower's head output [batch, outputs] and the batch's target (inside a tf.tidy). */
  loss(outputs: readonly tfCore.Tensor2D[], target: tfCore.Tensor2D | null): tfCore.Scalar;
}

/** What an objective knows when it is set up for one learner and one dataset. */
export interface ObjectiveContext {
  readonly tf: Tf;
  /** The learner's settings: input, target, offset, encoder, train (learningRate, temperature, …). */
  readonly learner: LearnerSpec;
  /** Entries per step of each channel. */
  readonly channelSize: Readonly<Record<ChannelName, number>>;
  /** How many classes a categorical latent has in this dataset. */
  classCount(latent: LatentName): number;
}

/**
 * An objective, built in or default-exported by a plug-in file (`objective: ./my-objective.ts`).
 * Tower 0 always reads the learner's input; its last hidden layer is the representation the
 * probes read. The objective never imports TensorFlow.js itself: it uses `context.tf`.
 */
export interface ObjectiveDefinition {
  readonly type: 'objective';
  /** The name results and the summary show; letters, digits, '.', '_' or '-'. */
  readonly name: string;
  /** One line on what the encoder is trained to do. */
  readonly description: string;
  /** Whether a learner with this objective lists `target` channels. */
  readonly target: TargetUse;
  /** Fewest rows a batch needs for the loss to be defined (InfoNCE needs a negative: 2); 1 when left out. */
  readonly minBatch?: number;
  /** The towers to build and the training signal; a null signal leaves the initial weights untrained. */
  setup(context: ObjectiveContext): { readonly towers: readonly TowerPlan[]; readonly signal: TrainingSignal | null };
}
