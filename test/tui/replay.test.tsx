import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { renderToString, type Key } from 'ink';
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../src/experiment/defaults.js';
import { makeRecording } from '../../src/experiment/recording.js';
import type { Recording } from '../../src/results/recording.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { ExploreScreen } from '../../src/tui/components/explore-screen.js';
import { keyNames } from '../../src/tui/explore/explore-app.js';
import { initialExploreState, reduceExplore, type ExploreState } from '../../src/tui/explore/explore-state.js';
import { exploreView, type TerminalSize } from '../../src/tui/explore/explore-view.js';
import { episodeStarts, initialReplayState, recordedStep, reduceReplay, type ReplayState } from '../../src/tui/explore/replay-state.js';
import { replayLine, replayView, timeline } from '../../src/tui/explore/replay-view.js';
import { loadWorld } from '../../src/world/parse.js';
import { ACTIONS } from '../../src/world/types.js';

// A uniform walk of 120 greenhouse steps in episodes of 50 (starts 0, 50, 100), the first
// from the world's start pose, exactly as `crosswise record` makes it.
const GREENHOUSE = resolve('worlds/greenhouse.yaml');
const world = loadWorld(GREENHOUSE);
const recording: Recording = makeRecording({
  cell: {
    world: { path: GREENHOUSE, sha256: createHash('sha256').update(readFileSync(GREENHOUSE)).digest('hex') },
    collect: { ...DEFAULTS.collect, policy: 'uniform', steps: 120, episodeSteps: 50 },
    senses: DEFAULT_SENSE_SETTINGS,
    seed: 6,
  },
  source: { kind: 'world' },
  noise: [],
});

const start = (): ReplayState => initialReplayState(recording, world, 3, false);
const press = (state: ReplayState, ...keys: string[]) => keys.reduce(reduceReplay, state);

describe('replay reducer: moving through the recording', () => {
  it('starts paused at step 0 at the world\'s start pose', () => {
    const s = start();
    expect([s.step, s.playing, s.explore.stepIndex, s.explore.pose, s.explore.action]).toEqual([0, false, 0, world.start, 'stay']);
  });

  it('steps forward with → and ., back with ← and ,, stopping at both ends', () => {
    expect(press(start(), 'right', '.', '.').step).toBe(3);
    expect(press(start(), 'right', 'right', 'left').step).toBe(1);
    expect(press(start(), ',').step).toBe(0);
    expect(press(start(), ...Array<string>(130).fill('.')).step).toBe(119);
  });

  it('moves 10 steps with ↑ and ↓, to the first and last step with Home and End', () => {
    expect(press(start(), 'up', 'up', 'down').step).toBe(10);
    expect(press(start(), 'end').step).toBe(119);
    expect(press(start(), 'end', 'home').step).toBe(0);
  });

  it('finds the episode starts and jumps between them with [ and ]', () => {
    expect(episodeStarts(recording)).toEqual([0, 50, 100]);
    expect(press(start(), ']').step).toBe(50);
    expect(press(start(), ']', ']', ']').step).toBe(119); // after the last start: the last step
    expect(press(start(), 'up', 'up', 'up', 'up', 'up', 'up', '[').step).toBe(50);
    expect(press(start(), ']', '[').step).toBe(0);
  });

  it('goes to a typed step on Enter; Backspace edits, Esc drops it, another key drops it and acts', () => {
    expect(press(start(), '7', '3').jump).toBe('73');
    expect(press(start(), '7', '3', 'enter')).toMatchObject({ step: 73, jump: null });
    expect(press(start(), '7', '3', 'backspace', 'enter').step).toBe(7);
    expect(press(start(), '9', '9', '9', 'enter').step).toBe(119);
    expect(press(start(), '7', 'escape')).toMatchObject({ step: 0, jump: null, explore: { quit: false } });
    expect(press(start(), '7', ']')).toMatchObject({ step: 50, jump: null });
  });

  it('plays one step per tick, pauses with space or p, and stops at the last step', () => {
    expect(press(start(), 'tick').step).toBe(0); // paused: a beat does nothing
    expect(press(start(), ' ', 'tick', 'tick')).toMatchObject({ step: 2, playing: true });
    expect(press(start(), 'p', 'tick', 'p', 'tick')).toMatchObject({ step: 1, playing: false });
    const end = press(start(), '1', '1', '8', 'enter', 'p', 'tick', 'tick');
    expect(end).toMatchObject({ step: 119, playing: false });
  });

  it('changes speed with < and > between 1 and 20 steps per second', () => {
    expect(start().speed).toBe(2);
    expect(press(start(), '>', '>', '>').speed).toBe(4);
    expect(press(start(), '<', '<', '<').speed).toBe(0);
  });

  it('keeps the explorer\'s noise, ground truth, help and quit keys; ignores the walking keys', () => {
    expect(press(start(), '+', '+').explore.noise.sight).toEqual({ kind: 'gaussian', severity: 2 });
    expect(press(start(), 'l', '?').explore).toMatchObject({ latents: true, help: true });
    expect(press(start(), 'q').explore.quit).toBe(true);
    expect(press(start(), 'escape').explore.quit).toBe(true);
    expect(press(start(), 'w', 'g', 't').step).toBe(0);
  });
});

describe('a recorded step', () => {
  it('holds the pose of the latents, the action taken and the moved/bumped flags', () => {
    for (const t of [1, 37, 50, 119]) {
      const step = recordedStep(recording, t);
      const latents = recording.latents.subarray(t * 12, t * 12 + 12);
      expect([step.pose.x, step.pose.y]).toEqual([latents[0], latents[1]]);
      expect(step.action).toBe(ACTIONS[recording.actions[t]]);
      expect([step.transition.moved, step.transition.bumped]).toEqual([latents[10] === 1, latents[11] === 1]);
      expect(step.recorded.senses.sound).toEqual(recording.channels.sound.subarray(t * 32, t * 32 + 32));
    }
  });
});

describe('the replay line', () => {
  it('draws a timeline: | where episodes begin, ● at the step', () => {
    // 120 steps on 12 cells: 10 steps per cell; starts 0, 50, 100 fall on cells 0, 5, 10.
    expect(timeline(12, 120, [0, 50, 100], 0)).toBe('●····|····|·');
    expect(timeline(12, 120, [0, 50, 100], 73)).toBe('|····|·●··|·');
    expect(timeline(200, 5, [0, 3], 4)).toBe('|··|●'); // never more than one cell per step
  });

  it('says where the replay is, whether an episode begins there, the split and the player', () => {
    const s = press(start(), ']');
    const split = ['train', 'validation', 'test'][recording.split[50]];
    const text = `replay 50/119 · episode 1 begins here (${split}) · ‖ paused 5/s`;
    expect(replayLine(s, 80)).toBe(`${text} ${timeline(80 - text.length - 1, 120, [0, 50, 100], 50)}`);
    expect(replayLine(s, 40)).toBe(`${text.slice(0, 39)}…`); // no room for a timeline: cut to fit
    expect(replayLine(press(s, '.', 'p', '>'), 200)).toMatch(new RegExp(`^replay 51/119 · episode 1 from step 50 \\(${split}\\) · ▶ playing 10/s [|·●]+$`));
    expect(replayLine(press(s, '4', '2'), 200)).toContain('· go to step 42_ (Enter)');
  });
});

/** The live explorer's key for each action. */
const KEY_OF: Readonly<Record<string, string>> = { forward: 'w', back: 's', 'turn-left': 'a', 'turn-right': 'd', stay: '.' };

const render = (view: ReturnType<typeof exploreView>, size: TerminalSize) => renderToString(<ExploreScreen view={view} />, { columns: size.columns }).split('\n');

describe('replay against live exploring', () => {
  it('shows the screen the live explorer shows after the same actions, noise and ground truth included', () => {
    // Live: the recorded actions of the first episode typed as keys. Replay: the same step.
    // The screens match line for line below the replay's extra line.
    const size = { columns: 120, rows: 40 };
    for (const t of [0, 9, 23, 49]) {
      const keys = Array.from({ length: t }, (_, i) => KEY_OF[ACTIONS[recording.actions[i + 1]]]);
      const live: ExploreState = [...keys, '+', '+', 'n', 'k', '+', 'l'].reduce(reduceExplore, initialExploreState([world], 3, false));
      const replay = press(start(), ...Array<string>(t).fill('.'), '+', '+', 'n', 'k', '+', 'l');
      const [liveLines, replayLines] = [render(exploreView(live, size), size), render(replayView(replay, size), size)];
      expect(replayLines[0]).toBe(liveLines[0]);
      expect(replayLines[0]).toContain(`step ${t} `);
      expect(replayLines[1]).toMatch(/^replay /);
      expect(replayLines.slice(2)).toEqual(liveLines.slice(1, replayLines.length - 1));
    }
  });
});

describe('keys as the root reads them', () => {
  const plain = {} as Key;
  it('splits keys that arrive together (typed fast, or pasted) into one key per character', () => {
    expect(keyNames('42', plain)).toEqual(['4', '2']);
    expect(keyNames('7\r', plain)).toEqual(['7', 'enter']);
    expect(keyNames('>>p', plain)).toEqual(['>', '>', 'p']);
  });

  it('names the special keys Ink reports', () => {
    expect(keyNames('', { ...plain, rightArrow: true })).toEqual(['right']);
    expect(keyNames('', { ...plain, return: true })).toEqual(['enter']);
    expect(keyNames('', { ...plain, backspace: true })).toEqual(['backspace']);
    expect(keyNames('', { ...plain, escape: true })).toEqual(['escape']);
    expect(keyNames('', { ...plain, home: true })).toEqual(['home']);
  });
});
