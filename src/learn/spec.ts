import type { ChannelName } from '../senses/channel.js';
import type { LatentName } from '../collect/dataset.js';

/** What a learner's encoder is trained to do (the config's `objective`). */
export const OBJECTIVES = ['predict', 'reconstruct', 'forecast', 'contrast', 'supervised', 'untrained'] as const;
export type ObjectiveName = (typeof OBJECTIVES)[number];

/**
 * Objectives whose learners are controls unless their config says otherwise: the floor
 * (frozen random weights) and the ceiling (trained on the latents themselves). A control
 * is reported beside the question, never in the primary family of hypotheses.
 */
export const CONTROL_OBJECTIVES: readonly ObjectiveName[] = ['untrained', 'supervised'];

/** How weight updates are computed (the config's `rule`). */
export const RULES = ['backprop', 'feedback-alignment', 'direct-feedback-alignment'] as const;
export type RuleName = (typeof RULES)[number];

/** Hidden-layer nonlinearities (the config's `encoder.activation`). */
export const ACTIVATIONS = ['relu', 'tanh', 'sigmoid'] as const;
export type ActivationName = (typeof ACTIVATIONS)[number];

/** Optimisers applied to the rule's updates (the config's `train.optimizer`). */
export const OPTIMIZERS = ['adam', 'sgd'] as const;
export type OptimizerName = (typeof OPTIMIZERS)[number];

/** TensorFlow.js backends that run on the CPU (the config's `backend`). */
export const BACKENDS = ['wasm', 'cpu'] as const;
export type BackendName = (typeof BACKENDS)[number];

/** Everything needed to train one learner; the config loader fills every default. */
export interface LearnerSpec {
  readonly name: string;
  readonly objective: ObjectiveName;
  /** Channels the encoder reads, concatenated in CHANNELS order. */
  readonly input: readonly ChannelName[];
  /** predict and contrast only: the channels to predict or align with. */
  readonly target: readonly ChannelName[];
  /** predict only: 0 predicts the target at the same step, 1 at the next step. */
  readonly offset: 0 | 1;
  /** supervised only: the latents predicted directly. */
  readonly supervisedTargets: readonly LatentName[];
  readonly encoder: { readonly hidden: readonly number[]; readonly activation: ActivationName };
  readonly rule: RuleName;
  readonly train: {
    readonly optimizer: OptimizerName;
    readonly learningRate: number;
    readonly batch: number;
    readonly epochs: number;
    /** Stop after this many epochs without a lower validation loss. */
    readonly patience: number;
    /** contrast only: InfoNCE temperature. */
    readonly temperature: number;
  };
}

/** One line of the training log. */
export interface EpochLog {
  readonly epoch: number;
  readonly trainLoss: number;
  readonly validationLoss: number;
  readonly seconds: number;
  /**
   * Mean weight-update angle in degrees, between the rule's update of a weight matrix and the
   * true gradient of the loss with respect to it, per weight matrix: the input encoder's hidden layers then its head, then (contrast) the
   * target encoder's; recorded every `alignEvery` steps (TrainOptions). Empty for backprop.
   */
  readonly alignmentDeg: readonly number[];
}

/** A trained, frozen encoder as the probes see it. */
export interface FeatureExtractor {
  /** Channels the encoder reads. */
  readonly input: readonly ChannelName[];
  /** Width of the representation (the last hidden layer). */
  readonly featureSize: number;
  /**
   * Features for n rows of raw (unstandardised) channel values, each [n, channelSize];
   * the encoder applies the standardisation fitted on its training split. Returns [n, featureSize].
   */
  features(inputs: Readonly<Partial<Record<ChannelName, Float32Array>>>, n: number): Float32Array;
  /** Frees the encoder's tensors. */
  dispose(): void;
}
