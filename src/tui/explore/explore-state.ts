import { NOISE_CHANNELS } from '../../noise/corrupt.js';
import type { ChannelNoise, RecordedStep } from '../../noise/explore-sample.js';
import { MAX_SEVERITY } from '../../noise/severity.js';
import { NOISE_KINDS, type NoiseKind } from '../../noise/spec.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS, type ChannelName, type SenseSettings } from '../../senses/channel.js';
import { stepsToNextSwitch } from '../../world/emitter.js';
import { step } from '../../world/movement.js';
import { type Action, type Pose, type Transition, type World } from '../../world/types.js';

/** Everything the explore screen shows is derived from this. */
export interface ExploreState {
  readonly worlds: readonly World[];
  readonly worldIndex: number;
  /** Sense sizes for every world (a config's `senses:`, or the defaults). */
  readonly settings: SenseSettings;
  readonly seed: number;
  readonly pose: Pose;
  /** The world clock: steps taken since the world was entered; emitters cycle on it. */
  readonly stepIndex: number;
  readonly action: Action;
  readonly transition: Transition;
  readonly noise: Readonly<Record<ChannelName, ChannelNoise>>;
  /** The channel the noise keys change. */
  readonly noiseChannel: ChannelName;
  readonly colour: boolean;
  readonly help: boolean;
  readonly latents: boolean;
  readonly quit: boolean;
  /** What a recording holds for this step (replay); the live explorer senses the pose instead. */
  readonly recorded?: RecordedStep;
}

/** A key as the root component names it: a printable character, up/down/left/right, home/end, enter, backspace or escape. */
export type ExploreKey = string;

const CLEAN: ChannelNoise = { kind: 'gaussian', severity: 0 };

/** Where the agent starts in a world: the file's start pose, else the first free cell facing north. */
export function startPose(world: World): Pose {
  if (world.start != null) return world.start;
  const i = world.solid.findIndex((s, k) => s === 0 && world.emitterAt[k] < 0);
  return { x: i % world.width, y: Math.floor(i / world.width), heading: 'north' };
}

function entered(state: Omit<ExploreState, 'pose' | 'stepIndex' | 'action' | 'transition'>, worldIndex: number): ExploreState {
  const pose = startPose(state.worlds[worldIndex]);
  return { ...state, worldIndex, pose, stepIndex: 0, action: 'stay', transition: { pose, moved: false, bumped: false } };
}

/** The first state: the first world at its start pose, clock at 0, every channel clean. */
export function initialExploreState(
  worlds: readonly World[], seed: number, colour: boolean, settings: SenseSettings = DEFAULT_SENSE_SETTINGS,
): ExploreState {
  if (worlds.length === 0) throw new Error('explore needs at least one world');
  const noise = Object.fromEntries(CHANNELS.map((c) => [c, CLEAN])) as Record<ChannelName, ChannelNoise>;
  return entered({ worlds, settings, seed, noise, noiseChannel: 'sight', colour, help: false, latents: false, quit: false, worldIndex: 0 }, 0);
}

const MOVES: Readonly<Record<string, Action>> = {
  up: 'forward', w: 'forward',
  down: 'back', s: 'back',
  left: 'turn-left', a: 'turn-left',
  right: 'turn-right', d: 'turn-right',
  ' ': 'stay', '.': 'stay',
};

/** The keys as the help lines list them; `reduceExplore` is their meaning. */
export const EXPLORE_KEYS: readonly (readonly [string, string])[] = [
  ['↑↓ ws', 'forward, back'], ['←→ ad', 'turn'], ['. space', 'stay one step'], ['t', 'stay until an emitter switches'],
  ['n', 'next channel'], ['k', 'noise kind'], ['+ -', 'severity'], ['g', 'next world'],
  ['c', 'colour'], ['l', 'ground truth'], ['?', 'keys'], ['q Esc', 'quit'],
];

/** The state after one key; keys it does not know leave the state unchanged. */
export function reduceExplore(state: ExploreState, key: ExploreKey): ExploreState {
  const action = MOVES[key];
  if (action != null) return acted(state, action, 1);
  switch (key) {
    case 't': return acted(state, 'stay', stepsToNextSwitch(state.worlds[state.worldIndex], state.stepIndex));
    case 'n': return { ...state, noiseChannel: CHANNELS[(CHANNELS.indexOf(state.noiseChannel) + 1) % CHANNELS.length] };
    case 'k': return withNoise(state, { kind: nextKind(state.noiseChannel, state.noise[state.noiseChannel].kind) });
    case '+': case '=': return withNoise(state, { severity: Math.min(MAX_SEVERITY, state.noise[state.noiseChannel].severity + 1) });
    case '-': return withNoise(state, { severity: Math.max(0, state.noise[state.noiseChannel].severity - 1) });
    case 'g': return entered(state, (state.worldIndex + 1) % state.worlds.length);
    case 'c': return { ...state, colour: !state.colour };
    case 'l': return { ...state, latents: !state.latents };
    case '?': return { ...state, help: !state.help };
    case 'q': case 'escape': return { ...state, quit: true };
    default: return state;
  }
}

function acted(state: ExploreState, action: Action, clockSteps: number): ExploreState {
  const transition = step(state.worlds[state.worldIndex], state.pose, action);
  return { ...state, pose: transition.pose, action, transition, stepIndex: state.stepIndex + clockSteps };
}

function withNoise(state: ExploreState, change: Partial<ChannelNoise>): ExploreState {
  const channel = state.noiseChannel;
  return { ...state, noise: { ...state.noise, [channel]: { ...state.noise[channel], ...change } } };
}

/** The next noise kind, in NOISE_KINDS order, that can corrupt the channel. */
function nextKind(channel: ChannelName, kind: NoiseKind): NoiseKind {
  const allowed = NOISE_KINDS.filter((k) => NOISE_CHANNELS[k].includes(channel));
  return allowed[(allowed.indexOf(kind) + 1) % allowed.length];
}
