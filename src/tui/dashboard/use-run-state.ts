import { useEffect, useReducer, useState } from 'react';
import type { RunEvent } from '../../experiment/events.js';
import { initialRunState, reduceRun, type RunState } from './run-state.js';

/** Registers a listener for run events and returns the function that removes it. */
export type Subscribe = (listener: (event: RunEvent) => void) => () => void;

/** The run state folded from `subscribe`'s events; the subscription ends on unmount. */
export function useRunState(subscribe: Subscribe, name: string, total: number, now: () => number): RunState {
  const [state, dispatch] = useReducer(
    (s: RunState, stamped: { readonly event: RunEvent; readonly atMs: number }) => reduceRun(s, stamped.event, stamped.atMs),
    undefined,
    () => initialRunState(name, total, now()),
  );
  useEffect(() => subscribe((event) => dispatch({ event, atMs: now() })), [subscribe, now]);
  return state;
}

/** The current time, refreshed every `intervalMs` while `running`, so elapsed time and ETA tick. */
export function useNow(now: () => number, intervalMs: number, running: boolean): number {
  const [nowMs, setNowMs] = useState(now);
  useEffect(() => {
    if (!running) return undefined;
    const timer = setInterval(() => setNowMs(now()), intervalMs);
    return () => clearInterval(timer);
  }, [now, intervalMs, running]);
  return nowMs;
}
