import { SPLIT_NAMES } from '../../results/recording.js';
import { cut } from '../format.js';
import { exploreView, type ExploreView, type TerminalSize } from './explore-view.js';
import { REPLAY_KEYS, stepsPerSecond, type ReplayState } from './replay-state.js';

/** A timeline narrower than this is left out of the replay line. */
const MIN_TIMELINE = 8;

/**
 * The recording as one line of `width` characters (at most one per step): `|` where an
 * episode begins, `●` at the step shown, `·` elsewhere.
 */
export function timeline(width: number, steps: number, episodeStarts: readonly number[], step: number): string {
  const cells = Math.min(width, steps);
  const cellOf = (t: number) => Math.floor((t * cells) / steps);
  const chars = new Array<string>(cells).fill('·');
  for (const start of episodeStarts) chars[cellOf(start)] = '|';
  chars[cellOf(step)] = '●';
  return chars.join('');
}

/** Where the replay is (step, episode and where it began, split, recorded noise), the player, and the timeline. */
export function replayLine(state: ReplayState, columns: number): string {
  const { recording, step } = state;
  const steps = recording.split.length;
  const split = SPLIT_NAMES[recording.split[step]];
  const start = state.episodeStarts.filter((t) => t <= step).at(-1) ?? 0;
  const episode = `episode ${recording.episodes[step]} ${start === step ? 'begins here' : `from step ${start}`}`;
  const noise = split === 'test' && recording.manifest.noise.length > 0
    ? ` · recorded noise: ${recording.manifest.noise.map((n) => `${n.channel} ${n.kind} ${n.severity}`).join(', ')}` : '';
  const player = state.jump != null ? `go to step ${state.jump}_ (Enter)` : `${state.playing ? '▶ playing' : '‖ paused'} ${stepsPerSecond(state)}/s`;
  const text = `replay ${step}/${steps - 1} · ${episode} (${split})${noise} · ${player}`;
  const room = columns - text.length - 1;
  return room >= MIN_TIMELINE ? `${text} ${timeline(room, steps, state.episodeStarts, step)}` : cut(text, columns);
}

/** The explore screen at the replay's step, with the replay's line and keys. */
export function replayView(state: ReplayState, size: TerminalSize): ExploreView {
  return exploreView(state.explore, size, { keys: REPLAY_KEYS, replay: replayLine(state, size.columns) });
}
