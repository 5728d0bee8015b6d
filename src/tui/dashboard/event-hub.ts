import type { RunEvent, RunListener } from '../../experiment/events.js';
import type { Subscribe } from './use-run-state.js';

/** Run events passed from the runner to one subscriber at a time. */
export interface EventHub {
  readonly emit: RunListener;
  readonly subscribe: Subscribe;
}

/**
 * A hub that keeps events emitted while nobody listens and replays them to the next
 * subscriber: the runner emits `sweep-start` before the dashboard has mounted.
 */
export function createEventHub(): EventHub {
  const backlog: RunEvent[] = [];
  let sink: RunListener | null = null;
  return {
    emit: (event) => {
      if (sink == null) backlog.push(event);
      else sink(event);
    },
    subscribe: (listener) => {
      for (const event of backlog.splice(0)) listener(event);
      sink = listener;
      return () => {
        if (sink === listener) sink = null;
      };
    },
  };
}
