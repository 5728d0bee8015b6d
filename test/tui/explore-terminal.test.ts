import { execFileSync, spawnSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';

// Drives `crosswise explore` in a real terminal: tmux on a private socket, so nothing else
// the machine runs in tmux is touched, and the server is killed at the end.
const hasTmux = spawnSync('tmux', ['-V']).status === 0;
if (!hasTmux) console.warn('skipping the explore terminal test: tmux is not installed (.ci/run installs it)');

const SOCKET = `crosswise-test-${process.pid}`;
const SESSION = 'explore';
const tmux = (...args: string[]) => execFileSync('tmux', ['-L', SOCKET, ...args], { encoding: 'utf8' });
const screen = () => tmux('capture-pane', '-p', '-t', SESSION);

/** Polls until `ready` holds; the first start of tsx on a busy machine can take many seconds. */
async function poll(ready: () => boolean, what: string, timeoutMs = 90_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (ready()) return;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`explore never showed ${what}; the screen was:\n${screen()}`);
}

/** The pane's text once `test` accepts it. */
async function waitForScreen(test: (text: string) => boolean, what: string): Promise<string> {
  await poll(() => test(screen()), what);
  return screen();
}

const mapRow = (text: string, row: string) => text.split('\n').some((line) => line.startsWith(`${row} `));

const statusLine = (text: string) => text.split('\n').find((l) => l.startsWith('greenhouse ·')) ?? '';

describe.skipIf(!hasTmux)('crosswise explore in a terminal', () => {
  afterAll(() => {
    spawnSync('tmux', ['-L', SOCKET, 'kill-server']);
  });

  it('redraws the pose and the panels after keys, and quits on q', async () => {
    tmux('new-session', '-d', '-x', '100', '-y', '32', '-s', SESSION, 'NO_COLOR=1 node bin/crosswise.js explore worlds/greenhouse.yaml');
    const first = await waitForScreen((t) => t.includes('facing east') && t.includes('? keys'), 'its first screen');
    expect(statusLine(first)).toBe('greenhouse · step 0 · x 2 y 7 facing east · stay: stayed');

    tmux('send-keys', '-t', SESSION, 'Up');
    const moved = await waitForScreen((t) => t.includes('step 1 '), 'step 1');
    expect(statusLine(moved)).toBe('greenhouse · step 1 · x 3 y 7 facing east · forward: moved');
    // Footsteps on gravel: the footfall bars fill once the agent has moved.
    expect(moved).toMatch(/footfall 1\s+█+\S*\s+0\.80/);
    expect(moved).toMatch(/forward\s+█+\s+1\.00/);
    expect(mapRow(moved, '#..>.................#')).toBe(true);

    tmux('send-keys', '-t', SESSION, 'a');
    const turned = await waitForScreen((t) => t.includes('step 2 '), 'step 2');
    expect(statusLine(turned)).toBe('greenhouse · step 2 · x 3 y 7 facing north · turn-left: stayed');
    expect(mapRow(turned, '#..^.................#')).toBe(true);

    tmux('send-keys', '-t', SESSION, '?');
    await waitForScreen((t) => t.includes('q quit') && t.includes('g world'), 'the help line');

    tmux('send-keys', '-t', SESSION, 'q');
    await poll(() => spawnSync('tmux', ['-L', SOCKET, 'has-session', '-t', SESSION]).status !== 0, 'its exit after q', 30_000);
  });
});
