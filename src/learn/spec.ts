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

/** Encoder kinds (the config's `encoder.kind`): rate units, or leaky integrate-and-fire neurons simulated in time. */
export const ENCODER_KINDS = ['mlp', 'spiking'] as const;
export type EncoderKindName = (typeof ENCODER_KINDS)[number];

/** What a spiking unit's membrane does after a spike (the config's `encoder.reset`). */
export const RESETS = ['subtract', 'zero'] as const;
export type ResetName = (typeof RESETS)[number];

/** How a spiking encoder's input enters its first layer (the config's `encoder.input_coding`). */
export const INPUT_CODINGS = ['current', 'poisson'] as const;
export type InputCodingName = (typeof INPUT_CODINGS)[number];

/** Surrogate derivatives of the spike in the backward pass (the config's `encoder.surrogate`). */
export const SURROGATES = ['fast-sigmoid', 'arctan', 'straight-through'] as const;
export type SurrogateName = (typeof SURROGATES)[number];

/** Learning rules that can train a spiking encoder (each with the same surrogate derivative). */
export const SPIKING_RULES: readonly RuleName[] = ['backprop', 'feedback-alignment', 'direct-feedback-alignment'];

/** A rate encoder: hidden layers of one activation. `kind` may be left out. */
export interface MlpEncoderSpec {
  readonly kind?: 'mlp';
  readonly hidden: readonly number[];
  readonly activation: ActivationName;
}

/** A spiking encoder: hidden layers of leaky integrate-and-fire units simulated for `steps` time steps per sample. */
export interface SpikingEncoderSpec {
  readonly kind: 'spiking';
  readonly hidden: readonly number[];
  /** Time steps T each sample is simulated for. */
  readonly steps: number;
  /** Length of one time step, ms. */
  readonly dtMs: number;
  /** Membrane time constant τ, ms. */
  readonly tauMs: number;
  /** Membrane potential at which a unit spikes (the input current times resistance is in the same units). */
  readonly threshold: number;
  readonly reset: ResetName;
  /** Time after a spike during which the membrane is held at 0, ms (a whole number of time steps). */
  readonly refractoryMs: number;
  readonly inputCoding: InputCodingName;
  readonly surrogate: SurrogateName;
  /** Steepness k of the surrogate derivative, per unit of membrane potential. */
  readonly surrogateSlope: number;
}

/** A learner's encoder. */
export type EncoderSpec = MlpEncoderSpec | SpikingEncoderSpec;

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
  readonly encoder: EncoderSpec;
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
  /** Spiking encoders only: the input encoder's activity on the validation split after the epoch. */
  readonly firing?: LayerFiring;
}

/** Spiking activity per hidden layer of an encoder, first layer first. */
export interface LayerFiring {
  /** Mean firing rate over units, samples and time steps, Hz. */
  readonly rateHz: readonly number[];
  /** Fraction of units that never spiked on any sample. */
  readonly silentFraction: readonly number[];
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
