import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readRecording } from '../../src/results/recording.js';
import { ACTIONS } from '../../src/world/types.js';

// `crosswise explore --replay` and live `crosswise explore` side by side in real terminals
// (tmux on a private socket, killed at the end): the recorded actions typed as keys into the
// live explorer must give, step for step, the screen the replay shows.
const hasTmux = spawnSync('tmux', ['-V']).status === 0;
if (!hasTmux) console.warn('skipping the replay terminal test: tmux is not installed (.ci/run installs it)');

const SOCKET = `crosswise-replay-${process.pid}`;
const tmux = (...args: string[]) => execFileSync('tmux', ['-L', SOCKET, ...args], { encoding: 'utf8' });
const screen = (session: string) => tmux('capture-pane', '-p', '-t', session);

/** The pane's lines without the blank rows tmux pads it with. */
const lines = (text: string) => text.replace(/\s+$/, '').split('\n');

/** The pane's text once `ready` accepts it; the first start on a busy machine can take many seconds. */
async function waitFor(session: string, ready: (text: string) => boolean, what: string, timeoutMs = 90_000): Promise<string> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const text = screen(session);
    if (ready(text)) {
      // Ink may still be drawing the frame: take it once two captures agree.
      await new Promise((resolve) => setTimeout(resolve, 300));
      if (screen(session) === text) return text;
    } else {
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
  }
  throw new Error(`${session} never showed ${what}; the screen was:\n${screen(session)}`);
}

/** The live explorer's key for each action. */
const KEY_OF: Readonly<Record<string, string>> = { forward: 'w', back: 's', 'turn-left': 'a', 'turn-right': 'd', stay: '.' };

describe.skipIf(!hasTmux)('crosswise explore --replay in a terminal', () => {
  afterAll(() => {
    spawnSync('tmux', ['-L', SOCKET, 'kill-server']);
  });

  it('shows the same screen as live exploring after the same actions, at two steps of the first episode', async () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'crosswise-replay-')), 'walk');
    execFileSync(process.execPath, ['bin/crosswise.js', 'record', 'worlds/greenhouse.yaml', '--steps', '100', '--seed', '4', '--policy', 'uniform', '--out', folder]);
    const { actions } = readRecording(folder);
    const keys = (from: number, to: number) => Array.from({ length: to - from }, (_, i) => KEY_OF[ACTIONS[actions[from + i + 1]]]);

    tmux('new-session', '-d', '-x', '120', '-y', '40', '-s', 'live', 'NO_COLOR=1 node bin/crosswise.js explore worlds/greenhouse.yaml --seed 2');
    tmux('new-session', '-d', '-x', '120', '-y', '40', '-s', 'replay', `NO_COLOR=1 node bin/crosswise.js explore --replay ${folder} --seed 2`);
    await waitFor('live', (t) => t.includes('step 0 ') && t.includes('? keys'), 'its first screen');
    await waitFor('replay', (t) => t.includes('replay 0/99') && t.includes('? keys'), 'its first screen');

    // Sight noise at severity 2 and the ground truth in both; then the same steps.
    tmux('send-keys', '-t', 'live', '+', '+', 'l', ...keys(0, 7));
    tmux('send-keys', '-t', 'replay', '+', '+', 'l', '7', 'Enter');
    const done = (t: string, step: number) => t.includes(`step ${step} `) && t.includes('ground truth') && t.includes('sight gaussian 2');
    let live = lines(await waitFor('live', (t) => done(t, 7), 'step 7'));
    let replay = lines(await waitFor('replay', (t) => done(t, 7) && t.includes('replay 7/99'), 'step 7'));
    expect(replay[0]).toBe(live[0]);
    expect(replay.slice(2)).toEqual(live.slice(1));

    tmux('send-keys', '-t', 'live', ...keys(7, 31));
    tmux('send-keys', '-t', 'replay', '3', '1', 'Enter');
    live = lines(await waitFor('live', (t) => done(t, 31), 'step 31'));
    replay = lines(await waitFor('replay', (t) => done(t, 31) && t.includes('replay 31/99'), 'step 31'));
    expect(replay[0]).toBe(live[0]);
    expect(replay[0]).toMatch(/^greenhouse · step 31 · x \d+ y \d+ facing \w+ · [a-z-]+: (moved|stayed|bumped) · noisy: sight$/);
    expect(replay[1]).toMatch(/^replay 31\/99 · episode 0 from step 0 \((train|validation|test)\) · ‖ paused 5\/s /);
    expect(replay.slice(2)).toEqual(live.slice(1));
  });
});
