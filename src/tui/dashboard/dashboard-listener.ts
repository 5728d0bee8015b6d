import type { RunListener } from '../../experiment/events.js';
import { createEventHub } from './event-hub.js';
import { renderDashboard } from './render-dashboard.js';

/**
 * Mounts the dashboard and returns the run listener that feeds it, in the shape the run
 * command plugs in. q or Ctrl-C raise SIGINT in this process (the keyboard no longer does
 * in raw mode), so the runner's own interrupt handling stops the sweep cleanly.
 */
export function dashboardListener(sweep: { readonly name: string }): RunListener {
  const hub = createEventHub();
  renderDashboard({ subscribe: hub.subscribe, onStop: () => process.kill(process.pid, 'SIGINT'), total: 0, name: sweep.name });
  return hub.emit;
}
