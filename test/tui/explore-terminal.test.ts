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

const statusLine = (text: string) => text.split('\n')[0];

/** The pane as a list of lines (tmux pads it to the terminal's height). */
const paneLines = (text: string) => text.replace(/\n$/, '').split('\n');

/** The last line that is not blank: the screen's footer. */
const lastLine = (text: string) => paneLines(text).filter((line) => line.trim() !== '').at(-1) ?? '';

describe.skipIf(!hasTmux)('crosswise explore in a terminal', () => {
  afterAll(() => {
    spawnSync('tmux', ['-L', SOCKET, 'kill-server']);
  });

  it('fits 80×24 with the ground truth on, redraws after keys, grows to 120×40 on resize, and quits on q', async () => {
    tmux('new-session', '-d', '-x', '80', '-y', '24', '-s', SESSION, 'NO_COLOR=1 node bin/crosswise.js explore worlds/greenhouse.yaml');
    const first = await waitForScreen((t) => t.includes('facing east') && t.includes('? keys'), 'its first screen');
    expect(statusLine(first)).toBe('greenhouse · step 0 · x 2 y 7 facing east · stay: stayed');

    tmux('send-keys', '-t', SESSION, 'Up');
    const moved = await waitForScreen((t) => t.includes('step 1 '), 'step 1');
    expect(statusLine(moved)).toBe('greenhouse · step 1 · x 3 y 7 facing east · forward: moved');
    // Footsteps on gravel: the footfall bars fill once the agent has moved.
    expect(moved).toMatch(/footfall_0\s+█+\S*\s+0\.80/);
    // The agent is a circle dark on its facing side: ◑ faces east.
    expect(mapRow(moved, '#..◑.................#')).toBe(true);

    tmux('send-keys', '-t', SESSION, 'a');
    const turned = await waitForScreen((t) => t.includes('step 2 '), 'step 2');
    expect(statusLine(turned)).toBe('greenhouse · step 2 · x 3 y 7 facing north · turn-left: turned');
    expect(mapRow(turned, '#..◓.................#')).toBe(true);

    // With the ground truth on the frame still fits: the status stays on the first row,
    // no line is longer than 80 and the footer is on the last row at most.
    tmux('send-keys', '-t', SESSION, 'l');
    const truth = await waitForScreen((t) => t.includes('ground truth'), 'the ground truth');
    expect(statusLine(truth)).toBe('greenhouse · step 2 · x 3 y 7 facing north · turn-left: turned');
    expect(paneLines(truth).length).toBe(24);
    expect(paneLines(truth).every((line) => line.length <= 80)).toBe(true);
    // The fan at (1, 1) from (3, 7) facing north: √(2² + 6²) cells × 0.5 m = 3.2 m, atan2(−2, 6) = −18° (left).
    expect(truth).toContain('nearest fan');
    expect(truth).toContain('3.2 m at -18° (left)');
    expect(lastLine(truth)).toMatch(/^\? keys · q quit/);

    tmux('send-keys', '-t', SESSION, '?');
    await waitForScreen((t) => t.includes('q Esc quit') && t.includes('g next world'), 'the help lines');

    // At 120×40 the whole map fits two characters per cell, and the motor panel finds room.
    tmux('resize-window', '-t', SESSION, '-x', '120', '-y', '40');
    const large = await waitForScreen((t) => t.includes('##. . ◓ . . '), 'the map at two characters per cell');
    expect(statusLine(large)).toBe('greenhouse · step 2 · x 3 y 7 facing north · turn-left: turned');
    expect(large).toContain('motor · last command');
    expect(mapRow(large, '#'.repeat(44))).toBe(true);
    expect(mapRow(large, `##. . ◓ ${'. '.repeat(17)}##`)).toBe(true);
    expect(paneLines(large).every((line) => line.length <= 120)).toBe(true);

    tmux('send-keys', '-t', SESSION, 'q');
    await poll(() => spawnSync('tmux', ['-L', SOCKET, 'has-session', '-t', SESSION]).status !== 0, 'its exit after q', 30_000);
  });
});
