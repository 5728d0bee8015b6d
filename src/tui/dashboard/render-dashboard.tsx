import { render } from 'ink';
import { summarise } from '../../stats/summarise.js';
import { Dashboard } from './dashboard.js';
import { createEventHub } from './event-hub.js';
import type { Summarise } from './run-view.js';
import type { Subscribe } from './use-run-state.js';

/** What the runner gives the dashboard. */
export interface DashboardOptions {
  /** Registers a run-event listener and returns its removal. */
  readonly subscribe: Subscribe;
  /** Called once when the user presses q or Ctrl-C; the runner should stop taking new cells. */
  readonly onStop: () => void;
  /** Cells in the sweep, shown until `sweep-start` arrives. */
  readonly total: number;
  readonly name: string;
}

/** A mounted dashboard: wait for it to close after `sweep-done`, or unmount it early. */
export interface DashboardHandle {
  waitUntilExit(): Promise<void>;
  unmount(): void;
}

/** Mean and 95% Student-t half-width of one learner's scores across seeds (null below 2 seeds). */
export const summariseScores: Summarise = (values) => {
  const s = summarise(values);
  return { mean: s.mean, halfWidth: s.n >= 2 ? (s.ciHigh - s.ciLow) / 2 : null };
};

/**
 * Mounts the run dashboard on the terminal. It closes by itself once it receives
 * `sweep-done`; Ctrl-C does not kill the process but calls `onStop`. It listens from
 * the moment it is called: events that arrive before the screen has mounted (the
 * runner emits `sweep-start` straight away) are kept and replayed.
 */
export function renderDashboard(options: DashboardOptions): DashboardHandle {
  const hub = createEventHub();
  const unsubscribe = options.subscribe(hub.emit);
  const instance = render(<Dashboard {...options} subscribe={hub.subscribe} summarise={summariseScores} now={Date.now} />, { exitOnCtrlC: false });
  return {
    waitUntilExit: async () => {
      await instance.waitUntilExit();
      unsubscribe();
    },
    unmount: () => {
      instance.unmount();
      unsubscribe();
    },
  };
}
