import { describe, expect, it } from 'vitest';
import type { RunEvent } from '../../src/experiment/events.js';
import { createEventHub } from '../../src/tui/dashboard/event-hub.js';

const start: RunEvent = { type: 'sweep-start', name: 'x', out: 'o', total: 2, skipped: 0, jobs: 1 };
const done: RunEvent = { type: 'sweep-done', done: 2, failed: 0, seconds: 1, summary: 's', interrupted: false };

describe('event hub', () => {
  it('replays events emitted before anyone subscribed, then passes new ones straight on', () => {
    const hub = createEventHub();
    hub.emit(start);
    const seen: RunEvent[] = [];
    hub.subscribe((e) => seen.push(e));
    hub.emit(done);
    expect(seen).toEqual([start, done]);
  });

  it('stops delivering after unsubscribe and keeps events for the next subscriber', () => {
    const hub = createEventHub();
    const first: RunEvent[] = [];
    const stop = hub.subscribe((e) => first.push(e));
    stop();
    hub.emit(start);
    const second: RunEvent[] = [];
    hub.subscribe((e) => second.push(e));
    expect([first, second]).toEqual([[], [start]]);
  });
});
