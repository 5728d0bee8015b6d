import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import type { RunEvent } from '../../src/experiment/events.js';
import { Dashboard } from '../../src/tui/dashboard/dashboard.js';
import type { Summarise } from '../../src/tui/dashboard/run-view.js';
import { SWEEP, cell, score } from './run-events.js';

/** An event source the test drives by hand. */
function source() {
  const listeners = new Set<(e: RunEvent) => void>();
  return {
    subscribe: (l: (e: RunEvent) => void) => { listeners.add(l); return () => { listeners.delete(l); }; },
    emit: (e: RunEvent) => { for (const l of listeners) l(e); },
    listeners,
  };
}

// Formatting only: the half-width is a fixed number so the test shows where it goes.
const meanWithFixedHalfWidth: Summarise = (v) => ({ mean: v.reduce((a, b) => a + b, 0) / v.length, halfWidth: 0.05 });

const tick = () => new Promise((resolve) => setTimeout(resolve, 20));

/** Waits until the dashboard has subscribed (its key handler is attached in the same commit). */
// Polling is bounded by time, not by a count of ticks: on a busy machine ink's throttled
// redraw can take seconds to arrive.
const PATIENCE_MS = 30_000;

async function mounted(events: { listeners: Set<unknown> }): Promise<void> {
  const deadline = Date.now() + PATIENCE_MS;
  while (events.listeners.size === 0 && Date.now() < deadline) await tick();
}

async function waitFor(read: () => string, pattern: string): Promise<string> {
  const deadline = Date.now() + PATIENCE_MS;
  while (Date.now() < deadline) {
    if (read().includes(pattern)) return read();
    await tick();
  }
  throw new Error(`screen never showed '${pattern}':\n${read()}`);
}

describe('Dashboard', () => {
  it('draws progress, workers and the score table after a sequence of events', async () => {
    const events = source();
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => {}} total={6} name="demo" summarise={meanWithFixedHalfWidth} now={() => 5000} />);
    await mounted(events);
    for (const e of SWEEP) events.emit(e);
    const frame = await waitFor(() => app.lastFrame() ?? '', 'epoch 3');
    expect(frame.split('\n')).toEqual([
      'crosswise run · demo · writing to runs/demo',
      'cells 2/6 done · 1 failed · 2 running · 1 queued',
      // Every event is stamped at 5 s, so both running cells have the whole mean (15 s) left: (15 + 15 + 15) / 2.
      'elapsed 0s · eta 23s · 2 workers',
      'last failure: autoencoder seed 2 [c3]: loss became NaN',
      '',
      'worker 1  sound-from-sight seed 2 [c2]          epoch 3  loss 0.1000 █▄▁',
      'worker 2  autoencoder seed 3 [c4]               starting',
      '',
      'wall_ahead (accuracy) · sight gaussian noise · mean ± 95% CI · 1 seed',
      'learner             sev 0     sev 3',
      'sound-from-sight    0.90      0.70',
      'autoencoder         0.80      0.40',
      '',
      't next target  n next noise  q stop (running cells finish)',
    ]);
    app.unmount();
  });

  it('shows the firing of a spiking learner under its worker line', async () => {
    const events = source();
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => {}} total={1} name="demo" summarise={meanWithFixedHalfWidth} now={() => 0} />);
    await mounted(events);
    events.emit({ type: 'cell-start', cell: cell(0, 'spiking-sound-from-sight', 1), worker: 1 });
    events.emit({ type: 'epoch', cell: cell(0, 'spiking-sound-from-sight', 1), worker: 1, log: {
      epoch: 1, trainLoss: 0.5, validationLoss: 0.6, seconds: 1, alignmentDeg: [], firing: { rateHz: [210, 35], silentFraction: [0, 0.25] },
    } });
    const frame = await waitFor(() => app.lastFrame() ?? '', 'epoch 1');
    expect(frame.split('\n').slice(4, 7)).toEqual([
      'worker 1  spiking-sound-from-sight seed 1 [c0]  epoch 1  loss 0.5000 ▁',
      '          firing 210 · 35 Hz · silent 0% · 25%',
      '',
    ]);
    app.unmount();
  });

  it('shows mean ± half-width once two seeds are in', async () => {
    const events = source();
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => {}} total={2} name="demo" summarise={meanWithFixedHalfWidth} now={() => 0} />);
    await mounted(events);
    events.emit({ type: 'cell-done', cell: cell(0, 'a', 1), worker: 1, seconds: 1, scores: [score(0, 0.5)] });
    events.emit({ type: 'cell-done', cell: cell(1, 'a', 2), worker: 1, seconds: 1, scores: [score(0, 0.7)] });
    const frame = await waitFor(() => app.lastFrame() ?? '', '2 seeds');
    expect(frame.split('\n')).toContain('a                   0.60±0.05');
    app.unmount();
  });

  it('cycles the target with t', async () => {
    const events = source();
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => {}} total={1} name="demo" summarise={meanWithFixedHalfWidth} now={() => 0} />);
    await mounted(events);
    events.emit({ type: 'cell-done', cell: cell(0, 'a', 1), worker: 1, seconds: 1, scores: [score(0, 0.5), score(0, 0.25, 'heading')] });
    await waitFor(() => app.lastFrame() ?? '', 'wall_ahead (accuracy) ·');
    app.stdin.write('t');
    const frame = await waitFor(() => app.lastFrame() ?? '', 'heading (accuracy) ·');
    expect(frame).toContain('a                   0.25');
    app.unmount();
  });

  it('calls onStop once on q and says it is stopping', async () => {
    const events = source();
    let stops = 0;
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => { stops += 1; }} total={1} name="demo" summarise={meanWithFixedHalfWidth} now={() => 0} />);
    await mounted(events);
    app.stdin.write('q');
    app.stdin.write('q');
    await waitFor(() => app.lastFrame() ?? '', 'stopping: letting running cells finish');
    app.stdin.write('\u0003'); // Ctrl-C
    await tick();
    expect(stops).toBe(1);
    app.unmount();
  });

  it('calls onStop on Ctrl-C', async () => {
    const events = source();
    let stops = 0;
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => { stops += 1; }} total={1} name="demo" summarise={meanWithFixedHalfWidth} now={() => 0} />);
    await mounted(events);
    app.stdin.write('\u0003');
    await waitFor(() => app.lastFrame() ?? '', 'stopping');
    expect(stops).toBe(1);
    app.unmount();
  });

  it('removes its listener when unmounted', async () => {
    const events = source();
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => {}} total={1} name="demo" summarise={meanWithFixedHalfWidth} now={() => 0} />);
    await mounted(events);
    expect(events.listeners.size).toBe(1);
    app.unmount();
    expect(events.listeners.size).toBe(0);
  });
});

describe('Dashboard at the end of a sweep', () => {
  it('says how the sweep ended and clears the worker lines', async () => {
    const events = source();
    const app = render(<Dashboard subscribe={events.subscribe} onStop={() => {}} total={6} name="demo" summarise={meanWithFixedHalfWidth} now={() => 5000} />);
    await mounted(events);
    for (const e of SWEEP) events.emit(e);
    events.emit({ type: 'sweep-done', done: 2, failed: 1, seconds: 75, summary: '2 done, 1 failed', interrupted: true });
    const frame = await waitFor(() => app.lastFrame() ?? '', 'stopped:');
    expect(frame.split('\n').slice(0, 7)).toEqual([
      'crosswise run · demo · writing to runs/demo',
      'cells 2/6 done · 1 failed · 0 running · 3 queued',
      'took 1m15s · 2 workers',
      'stopped: 2 done, 1 failed',
      'last failure: autoencoder seed 2 [c3]: loss became NaN',
      '',
      'no cell running',
    ]);
    app.unmount();
  });
});
