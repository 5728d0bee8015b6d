import { LATENT_NAMES, type LatentName } from '../../collect/dataset.js';
import type { RecordedStep } from '../../noise/explore-sample.js';
import { manifestSenses, type Recording } from '../../results/recording.js';
import { CHANNELS, type ChannelName } from '../../senses/channel.js';
import { ACTIONS, HEADINGS, type Pose, type Transition, type World } from '../../world/types.js';
import { initialExploreState, reduceExplore, type ExploreKey, type ExploreState } from './explore-state.js';

/** Replay speeds in steps per second, slowest first. */
export const REPLAY_SPEEDS = [1, 2, 5, 10, 20] as const;

/** Everything the replay screen shows is derived from this. */
export interface ReplayState {
  /** The explore state at the current step: pose, action and recorded senses, with the viewer's noise and toggles. */
  readonly explore: ExploreState;
  readonly recording: Recording;
  /** The step shown, 0 .. steps − 1. */
  readonly step: number;
  readonly playing: boolean;
  /** Index into REPLAY_SPEEDS. */
  readonly speed: number;
  /** The digits typed of a step to jump to, or null when none is being typed. */
  readonly jump: string | null;
  /** The first step of every episode, ascending (step 0 first). */
  readonly episodeStarts: readonly number[];
}

/** The keys as the help lines list them; `reduceReplay` is their meaning. */
export const REPLAY_KEYS: readonly (readonly [string, string])[] = [
  ['→ .', 'next step'], ['← ,', 'previous step'], ['↑ ↓', '10 steps on, back'], ['Home End', 'first, last step'], ['[ ]', 'episode start before, after'],
  ['space p', 'play, pause'], ['< >', 'slower, faster'], ['0-9 Enter', 'go to step'],
  ['n', 'next channel'], ['k', 'noise kind'], ['+ -', 'severity'], ['c', 'colour'], ['l', 'ground truth'], ['?', 'keys'], ['q Esc', 'quit'],
];

/** Keys the replay hands to the live explorer's reducer: noise, colour, ground truth, help and quit. */
const EXPLORE_KEYS_KEPT = new Set(['n', 'k', '+', '=', '-', 'c', 'l', '?', 'q', 'escape']);

const AT = Object.fromEntries(LATENT_NAMES.map((name, j) => [name, j])) as Record<LatentName, number>;

/** The pose, action, transition and recorded values of one step of a recording. */
export function recordedStep(recording: Recording, t: number): Pick<ExploreState, 'pose' | 'action' | 'transition' | 'stepIndex'> & { readonly recorded: RecordedStep } {
  const row = recording.latents.subarray(t * LATENT_NAMES.length, (t + 1) * LATENT_NAMES.length);
  const pose: Pose = { x: row[AT.x], y: row[AT.y], heading: HEADINGS[row[AT.heading]] };
  const transition: Transition = { pose, moved: row[AT.moved] === 1, bumped: row[AT.bumped] === 1 };
  const senses = Object.fromEntries(CHANNELS.map((c) => {
    const values = recording.channels[c];
    const width = values.length / recording.split.length;
    return [c, values.subarray(t * width, (t + 1) * width)];
  })) as Record<ChannelName, Float32Array>;
  const latents = Object.fromEntries(LATENT_NAMES.map((name, j) => [name, row[j]])) as Record<LatentName, number>;
  return { pose, action: ACTIONS[recording.actions[t]], transition, stepIndex: t, recorded: { senses, latents } };
}

/** The first step of each episode of a recording. */
export function episodeStarts(recording: Recording): number[] {
  const { episodes } = recording;
  return Array.from(episodes.keys()).filter((t) => t === 0 || episodes[t] !== episodes[t - 1]);
}

/** The first replay state: step 0, paused at 5 steps per second, every channel clean. */
export function initialReplayState(recording: Recording, world: World, seed: number, colour: boolean): ReplayState {
  const explore = initialExploreState([world], seed, colour, manifestSenses(recording.manifest));
  return { explore: { ...explore, ...recordedStep(recording, 0) }, recording, step: 0, playing: false, speed: 2, jump: null, episodeStarts: episodeStarts(recording) };
}

/** The state showing step t (clamped to the recording). */
function at(state: ReplayState, t: number): ReplayState {
  const step = Math.min(state.recording.split.length - 1, Math.max(0, t));
  return { ...state, step, explore: { ...state.explore, ...recordedStep(state.recording, step) } };
}

/**
 * The state after one key, or after `tick` (one beat of the player: the next step while
 * playing, stopping at the last). While a step number is being typed, digits, Backspace
 * and Enter edit and take it, Esc drops it, and any other key drops it and acts as usual.
 */
export function reduceReplay(state: ReplayState, key: ExploreKey): ReplayState {
  if (key === 'tick') return tick(state);
  if (/^[0-9]$/.test(key)) return { ...state, jump: `${state.jump ?? ''}${key}`.slice(0, 9) };
  if (state.jump != null) {
    if (key === 'backspace') return { ...state, jump: state.jump.length > 1 ? state.jump.slice(0, -1) : null };
    if (key === 'enter') return { ...at(state, Number(state.jump)), jump: null };
    if (key === 'escape') return { ...state, jump: null };
    return reduceReplay({ ...state, jump: null }, key);
  }
  const last = state.recording.split.length - 1;
  switch (key) {
    case 'right': case '.': return at(state, state.step + 1);
    case 'left': case ',': return at(state, state.step - 1);
    case 'home': return at(state, 0);
    case 'end': return at(state, last);
    case 'up': return at(state, state.step + 10);
    case 'down': return at(state, state.step - 10);
    case '[': return at(state, state.episodeStarts.filter((t) => t < state.step).at(-1) ?? 0);
    case ']': return at(state, state.episodeStarts.find((t) => t > state.step) ?? last);
    case ' ': case 'p': return { ...state, playing: !state.playing && state.step < last };
    case '<': return { ...state, speed: Math.max(0, state.speed - 1) };
    case '>': return { ...state, speed: Math.min(REPLAY_SPEEDS.length - 1, state.speed + 1) };
    default: return EXPLORE_KEYS_KEPT.has(key) ? { ...state, explore: reduceExplore(state.explore, key) } : state;
  }
}

function tick(state: ReplayState): ReplayState {
  if (!state.playing) return state;
  const next = at(state, state.step + 1);
  return next.step === state.recording.split.length - 1 ? { ...next, playing: false } : next;
}

/** Steps per second of the player. */
export function stepsPerSecond(state: ReplayState): number {
  return REPLAY_SPEEDS[state.speed];
}
