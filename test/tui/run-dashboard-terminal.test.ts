import { execFileSync, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { configFolder } from '../experiment/helpers.js';

// Drives `crosswise run` with the dashboard in a real terminal (tmux on a private socket),
// with the experiment tests' double for the cell work so no learner is trained.
const hasTmux = spawnSync('tmux', ['-V']).status === 0;
if (!hasTmux) console.warn('skipping the run dashboard terminal test: tmux is not installed (.ci/run installs it)');

const SOCKET = `crosswise-dash-test-${process.pid}`;
const tmux = (...args: string[]) => execFileSync('tmux', ['-L', SOCKET, ...args], { encoding: 'utf8' });
const screen = (session: string) => tmux('capture-pane', '-p', '-t', session);

const CONFIG = `name: dash
world: world.yaml
seeds: [1, 2, 3]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], train: { epochs: 4 } }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight], train: { epochs: 4 } }
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2] }
out: out
`;

async function waitForScreen(session: string, test: (text: string) => boolean, what: string, timeoutMs = 90_000): Promise<string> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const text = screen(session);
    if (test(text)) return text;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`the dashboard never showed ${what}; the screen was:\n${screen(session)}`);
}

/** Starts the run in a new session; the shell prints the exit code and keeps the pane open. */
function startRun(session: string, epochMs: number): void {
  const config = join(configFolder(CONFIG), 'config.yaml');
  tmux('new-session', '-d', '-x', '80', '-y', '24', '-s', session,
    `FAKE_EPOCH_MS=${epochMs} node --import tsx test/tui/run-with-dashboard.ts ${config} --jobs 1; echo "exit $?"; sleep 120`);
}

describe.skipIf(!hasTmux)('crosswise run dashboard in a terminal', () => {
  afterAll(() => {
    spawnSync('tmux', ['-L', SOCKET, 'kill-server']);
  });

  it('shows a running worker, stops cleanly on q and leaves the resume command', async () => {
    startRun('stop', 500);
    const running = await waitForScreen('stop', (t) => /worker 1 .*epoch \d/.test(t), 'a worker in training');
    expect(running.split('\n')[0]).toMatch(/^crosswise run · dash · writing to \/.*\/out$/);
    expect(running).toMatch(/cells \d\/6 done · 0 failed · 1 running · \d queued/);
    tmux('send-keys', '-t', 'stop', 'q');
    const stopped = await waitForScreen('stop', (t) => t.includes('exit '), 'the end of the run');
    expect(stopped).toContain('exit 130');
    expect(stopped).toMatch(/^stopped: /m);
    expect(stopped.replace(/\n/g, '')).toMatch(/resume with: crosswise run \S+config\.yaml/); // the path may wrap
    expect(stopped).not.toMatch(/cells 6\/6 done/);
  });

  it('fills the results table with mean ± CI once two seeds are in, and exits 0 at the end', async () => {
    startRun('full', 20);
    const done = await waitForScreen('full', (t) => t.includes('exit '), 'the end of the run');
    expect(done).toContain('exit 0');
    expect(done).toMatch(/^cells 6\/6 done · 0 failed · 0 running · 0 queued$/m);
    expect(done).toMatch(/^learner +sev 0 +sev 2$/m);
    expect(done).toMatch(/^sound-from-sight +\d\.\d\d±\d\.\d\d +\d\.\d\d±\d\.\d\d$/m);
  });
});
