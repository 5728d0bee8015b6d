import { everyPoseSample } from '../collect/every-pose.js';
import { latentsAt } from '../collect/latents.js';
import type { LatentName } from '../collect/dataset.js';
import { createRng } from '../random.js';
import { CHANNELS, type ChannelName, type SenseSettings } from '../senses/channel.js';
import { bandCentresHz } from '../senses/mel.js';
import { sceneFor } from '../senses/scene.js';
import { senseAll } from '../senses/sense-all.js';
import { viewFrom } from '../senses/sight.js';
import { emitterIsOn } from '../world/emitter.js';
import type { Action, Pose, Transition, World } from '../world/types.js';
import { corruptChannel } from './corrupt.js';
import { channelReference, type ChannelReference } from './reference.js';
import { severityParameter } from './severity.js';
import type { NoiseKind } from './spec.js';

/** The corruption one channel gets on the explore screen. */
export interface ChannelNoise {
  readonly kind: NoiseKind;
  /** 0 is clean; 1..MAX_SEVERITY index the severity table. */
  readonly severity: number;
}

/** One step of a walk through a world, with the noise setting of each channel. */
export interface ExploreStep {
  readonly world: World;
  /** Position of the world in the explorer's list; names the noise stream. */
  readonly worldIndex: number;
  readonly settings: SenseSettings;
  readonly seed: number;
  readonly pose: Pose;
  readonly transition: Transition;
  readonly action: Action;
  /** The world clock; emitters cycle on it. */
  readonly stepIndex: number;
  readonly noise: Readonly<Record<ChannelName, ChannelNoise>>;
  /** What a recording holds for this step, shown instead of sensing the pose afresh (replay). */
  readonly recorded?: RecordedStep;
}

/** One step of a recording: every channel as recorded and the ground truth (categorical values as class indices). */
export interface RecordedStep {
  readonly senses: Readonly<Record<ChannelName, Float32Array>>;
  readonly latents: Readonly<Record<LatentName, number>>;
}

/** Everything the explore screen shows about one step, computed and ready to format. */
export interface ExploreSample {
  /** Every channel, each corrupted as its noise setting says. */
  readonly senses: Readonly<Record<ChannelName, Float32Array>>;
  /** Each channel's noise parameter from the severity table (the clean value at severity 0). */
  readonly noiseParameter: Readonly<Record<ChannelName, number>>;
  /** The clean ground truth (categorical values are class indices). */
  readonly latents: Readonly<Record<LatentName, number>>;
  /** Map cells (y · width + x) inside the sight field and not hidden behind solid cells. */
  readonly cellsInView: ReadonlySet<number>;
  /** Centre frequency of each sound band in Hz. */
  readonly bandsHz: Float64Array;
  /** Whether each emitter sounds at this step. */
  readonly sounding: readonly boolean[];
}

const references = new WeakMap<World, Map<string, Record<ChannelName, ChannelReference>>>();

/**
 * Channel spreads and silence levels the noise is scaled by. A walk has no training
 * split, so the sample of every pose (collect/every-pose.ts) stands in for one.
 */
export function everyPoseReference(world: World, settings: SenseSettings): Record<ChannelName, ChannelReference> {
  const bySettings = references.get(world) ?? new Map<string, Record<ChannelName, ChannelReference>>();
  references.set(world, bySettings);
  const key = JSON.stringify(settings);
  const cached = bySettings.get(key);
  if (cached != null) return cached;
  const sample = everyPoseSample(world, settings);
  const all = Int32Array.from({ length: sample.rows }, (_, i) => i);
  const reference = Object.fromEntries(CHANNELS.map((c) => {
    const values = sample.channels[c];
    return [c, channelReference(values, values.length / sample.rows, all, c)];
  })) as Record<ChannelName, ChannelReference>;
  bySettings.set(key, reference);
  return reference;
}

/**
 * The step as the explore screen shows it: the senses at the pose, or what a recording
 * holds for the step, each channel then corrupted as its noise setting says. Noise draws
 * come from the stream `explore/<world>/<step>/<channel>/<kind>/<severity>` of the seed,
 * so drawing the same step again, live or replayed, shows the same noise.
 */
export function exploreSample(step: ExploreStep): ExploreSample {
  const { world, settings } = step;
  const clean = step.recorded?.senses ?? senseAll(world, step.pose, step.transition, step.action, step.stepIndex, settings);
  const senses = { ...clean };
  const noiseParameter = {} as Record<ChannelName, number>;
  for (const channel of CHANNELS) {
    const { kind, severity } = step.noise[channel];
    noiseParameter[channel] = severityParameter(kind, severity);
    if (severity === 0) continue;
    const rng = createRng(step.seed, 'explore', step.worldIndex, step.stepIndex, channel, kind, severity);
    const reference = everyPoseReference(world, settings)[channel];
    senses[channel] = corruptChannel(clean[channel], clean[channel].length, kind, noiseParameter[channel], reference, rng);
  }
  const view = viewFrom(sceneFor(world, settings), step.pose);
  return {
    senses,
    noiseParameter,
    latents: step.recorded?.latents ?? latentsAt(world, step.pose, step.transition, settings),
    cellsInView: new Set([...view].filter((cell) => cell >= 0)),
    bandsHz: bandCentresHz(settings),
    sounding: world.emitters.map((e) => emitterIsOn(e, step.stepIndex)),
  };
}
