import type { LatentName } from '../collect/dataset.js';
import type { PolicyName } from '../collect/policies.js';
import { CONTROL_OBJECTIVES, type ActivationName, type BackendName, type EncoderKindName, type InputCodingName, type ObjectiveName, type OptimizerName, type ResetName, type RuleName, type SpikingEncoderSpec, type SurrogateName } from '../learn/spec.js';
import type { SeedMeasure } from '../probe/robustness.js';
import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';

/** How the agent gathers experience for one seed. */
export interface CollectSettings {
  readonly policy: PolicyName;
  readonly steps: number;
  readonly episodeSteps: number;
  readonly split: { readonly train: number; readonly validation: number; readonly test: number };
}

/** What the linear read-outs predict and whom the learners are compared against. */
export interface ProbeSettings {
  readonly targets: readonly LatentName[];
  /** Name of the learner that corruption errors are relative to and paired tests compare against. */
  readonly baseline: string;
  /** The per-seed measure the primary family of hypotheses tests (report only; not part of a cell's id). */
  readonly primary: SeedMeasure;
}

/**
 * What a cell records beside its numbers. Output-only: these settings never change a
 * number, so they are not part of a cell's identity (changing them does not rerun cells).
 */
export interface OutputSettings {
  /** Also store features.npy and latents.npy of every collected step. */
  readonly saveFeatures: boolean;
  /** Non-backprop rules: steps between measurements of the update/gradient angle (train.csv). */
  readonly alignEvery: number;
}

/**
 * Every default a config may leave out, in one place (config keys are the snake_case of these).
 * A config file holds only the settings it changes; `config.resolved.yaml` shows all of them.
 */
export const DEFAULTS = {
  /** Seeds of the sweep; each seed regenerates world experience, weights and noise draws. */
  seeds: [1, 2, 3] as readonly number[],
  /** TensorFlow.js backend of each worker: wasm (SIMD, ~5× faster) or cpu (plain JavaScript). */
  backend: 'wasm' as BackendName,
  collect: {
    /** Behaviour policy: wander (persistent random walk), uniform (i.i.d. actions), seek (heads for emitters). */
    policy: 'wander',
    /** Agent steps collected per seed; 20 000 steps take about a second to collect. */
    steps: 20_000,
    /** Steps before the agent is reset to a random free cell; episodes are the unit of the split. */
    episodeSteps: 200,
    /** Fractions of episodes for training, early stopping / probe penalty choice, and scoring. */
    split: { train: 0.7, validation: 0.15, test: 0.15 },
  } as CollectSettings,
  /** Sight field in cells (width × depth) and sound bands in Hz; see src/senses/channel.ts. */
  senses: DEFAULT_SENSE_SETTINGS as SenseSettings,
  learner: {
    /** predict and contrast only: channels to predict or align with (no default; required there). */
    target: [] as readonly string[],
    /** predict only: 0 predicts the target at the same step, 1 at the next step. */
    offset: 0 as 0 | 1,
    /** supervised only: latents predicted directly; empty means the probe targets. */
    supervisedTargets: [] as readonly LatentName[],
    encoder: {
      /** mlp: rate units with an activation; spiking: leaky integrate-and-fire units simulated in time (README, "Spiking encoders"). */
      kind: 'mlp' as EncoderKindName,
      /** Units per hidden layer; the last layer is the representation the probes read. */
      hidden: [128, 64] as readonly number[],
      /** mlp only: the hidden layers' nonlinearity. */
      activation: 'relu' as ActivationName,
      /** spiking only: time steps T each sample is simulated for; the probes read spike count ÷ T. */
      steps: 16,
      /** spiking only: length of one time step, ms. */
      dtMs: 1,
      /**
       * spiking only: membrane time constant τ, ms. Short beside the simulated window (steps × dt_ms) so the membrane
       * settles within it; cortical neurons are slower, ~10–20 ms (Gerstner et al. 2014). Tuned on the demo worlds.
       */
      tauMs: 2,
      /** spiking only: membrane potential at which a unit spikes; an input current of this size (times resistance) is the rheobase. */
      threshold: 1,
      /** spiking only: after a spike the membrane loses the threshold (subtract) or returns to 0 (zero). */
      reset: 'subtract' as ResetName,
      /** spiking only: time after a spike during which the membrane is held at 0, ms; a whole number of time steps. */
      refractoryMs: 0,
      /** spiking only: current (the standardised input held over the steps) or poisson (Bernoulli spikes, p = logistic of the input per step). */
      inputCoding: 'current' as InputCodingName,
      /** spiking only: the spike's derivative in the backward pass: fast-sigmoid (Zenke & Ganguli 2018), arctan (Fang et al. 2021) or straight-through. */
      surrogate: 'fast-sigmoid' as SurrogateName,
      /** spiking only: steepness k of the surrogate, per unit of membrane potential (tuned on the demo worlds; common practice spans ~1–100). */
      surrogateSlope: 5,
    },
    /** Learning rule: exact gradients, or a fixed random feedback path (Lillicrap 2016; Nøkland 2016). */
    rule: 'backprop' as RuleName,
    train: {
      optimizer: 'adam' as OptimizerName,
      /** Step size; 1e-3 is the usual Adam setting (Kingma & Ba 2015). */
      learningRate: 0.001,
      /** Samples per update. */
      batch: 256,
      /** Passes over the training split at most. */
      epochs: 10,
      /** Epochs without a lower validation loss before training stops early. */
      patience: 3,
      /** contrast only: InfoNCE temperature; 0.1 is common practice (Chen et al. 2020 use 0.1–0.5). */
      temperature: 0.1,
      /** Non-backprop rules: steps between measurements of the update/gradient angle (output-only, see OutputSettings). */
      alignEvery: 50,
    },
    /** Also write the features and the latents of every collected step (features.npy, latents.npy) beside the cell's scores (output-only). */
    saveFeatures: false,
    /**
     * Whether the learner is a control (a floor or a ceiling), compared with the baseline in
     * the exploratory family only; when a config leaves it out, learners with these objectives are.
     */
    controlObjectives: CONTROL_OBJECTIVES,
  },
  probe: {
    /** Latents read out linearly from the frozen features. */
    targets: ['wall_ahead', 'material_ahead', 'nearest_emitter', 'nearest_distance_m', 'heading'] as readonly LatentName[],
    /**
     * The per-seed measure of the primary family: noisy (the mean chance-corrected score over
     * the noisy severities: how much of the world the features still carry under noise), drop
     * (corrected clean score − noisy) or area (normalised area under the corrected curve).
     */
    primary: 'noisy' as SeedMeasure,
  },
  /** Corruptions scored at test time; none by default (clean scores only). */
  noise: [] as readonly never[],
  /** Severities scored when a noise entry names none: clean plus the five documented levels. */
  severities: [0, 1, 2, 3, 4, 5] as readonly number[],
  /** Output folder when a config names none: runs/<name>, relative to the config file like `out`. */
  outRoot: 'runs',
} as const;

/** Whether a learner is a control: as its config says, else by its objective (DEFAULTS.learner.controlObjectives). */
export function isControl(objective: ObjectiveName, control: boolean | undefined): boolean {
  return control ?? DEFAULTS.learner.controlObjectives.includes(objective);
}

/** A spiking encoder with every default, as `encoder: { kind: spiking }` gives it. */
export const SPIKING_DEFAULTS: SpikingEncoderSpec = (({ hidden, steps, dtMs, tauMs, threshold, reset, refractoryMs, inputCoding, surrogate, surrogateSlope }) => ({
  kind: 'spiking', hidden, steps, dtMs, tauMs, threshold, reset, refractoryMs, inputCoding, surrogate, surrogateSlope,
}))(DEFAULTS.learner.encoder);
