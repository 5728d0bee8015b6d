import { availableParallelism } from 'node:os';
import { PIPELINE_MODULE } from '../experiment/cell-work.js';
import type { RunEvent, RunListener } from '../experiment/events.js';
import { plainLogger } from '../experiment/plain-log.js';
import { planCells } from '../experiment/plan.js';
import { runSweep } from '../experiment/runner.js';
import { loadSweepFrom, runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { count, printProblem } from './messages.js';
import { runUsage } from './run-usage.js';

/** What a terminal dashboard needs from the run. */
export interface DashboardHooks {
  readonly name: string;
  readonly total: number;
  /** Registers an event listener; returns its removal. */
  readonly subscribe: (listener: RunListener) => () => void;
  /** Stops the sweep (the user pressed q or Ctrl-C). */
  readonly onStop: () => void;
}

/** What the caller may plug into `run`: the terminal dashboard, or other cell work. */
export interface RunCommandParts {
  /** Module exporting `cellWork`; the collect–train–probe pipeline unless given. */
  readonly workModule?: string;
  /** Mounts the dashboard when stdout is a terminal and --plain is not given; resolves when it has closed. */
  readonly dashboard?: Dashboard;
}

type Dashboard = (hooks: DashboardHooks) => { waitUntilExit(): Promise<void>; unmount(): void };

/** The Ink dashboard, loaded only when a run shows it (Ink and React take a while to load). */
async function terminalDashboard(): Promise<Dashboard> {
  return (await import('../tui/dashboard/render-dashboard.js')).renderDashboard;
}

/** `crosswise run`: the whole sweep, resumable (see run-usage.ts). */
export async function runCommand(args: readonly string[], parts: RunCommandParts = {}): Promise<number> {
  return runAction(runUsage, args, async ({ operands: [config], values }) => {
    const jobs = values.jobs ?? availableParallelism();
    const loaded = loadSweepFrom(config, values.out);
    const warn = () => loaded.warnings.forEach((warning) => printProblem('run', warning));
    const sweep = values.backend == null ? loaded : { ...loaded, backend: values.backend };
    const controller = new AbortController();
    const abandon = new AbortController();
    // The first Ctrl-C lets running cells finish; a second one abandons them (nothing half-written either way).
    const stop = () => {
      if (controller.signal.aborted) abandon.abort();
      else if (dashboard == null) console.log('stopping: running cells finish first (Ctrl-C again to abandon them)');
      controller.abort();
    };
    const listeners = new Set<RunListener>();
    const useDashboard = !values.plain && process.stdout.isTTY;
    const dashboard = useDashboard
      ? (parts.dashboard ?? await terminalDashboard())({ name: sweep.name, total: planCells(sweep).length, subscribe: (l) => { listeners.add(l); return () => listeners.delete(l); }, onStop: stop })
      : undefined;
    // Warnings follow the first line (where the sweep writes): right after it in plain mode,
    // after the dashboard has closed otherwise, so the live screen does not hide them.
    if (dashboard == null) {
      const log = plainLogger((line) => console.log(line));
      listeners.add((event) => { log(event); if (event.type === 'sweep-start') warn(); });
    }
    process.on('SIGINT', stop);
    process.on('SIGTERM', stop);
    try {
      const outcome = await runSweep(sweep, {
        jobs,
        workModule: parts.workModule ?? PIPELINE_MODULE,
        listeners: [(event: RunEvent) => listeners.forEach((listener) => listener(event))],
        signal: controller.signal,
        abandon: abandon.signal,
        report: buildSummary,
        warn: (line) => printProblem('run', `warning: ${line}`),
        force: values.force,
        retryFailed: values['retry-failed'],
      }).catch((error: unknown) => {
        dashboard?.unmount(); // the sweep never started (a busy or foreign output folder): take the screen down before the message
        throw error;
      });
      if (dashboard != null) {
        await dashboard.waitUntilExit();
        warn();
      }
      if (outcome.writeFailures.length > 0) {
        for (const line of outcome.writeFailures) printProblem('run', line);
        printProblem('run', `no new cells were started after a write failed; free space or fix the folder's permissions, then resume with: ${resumeCommand(config, values.out)}`);
        return EXIT.writeFailed;
      }
      if (outcome.interrupted) {
        console.log(`stopped; finished cells are kept. resume with: ${resumeCommand(config, values.out)}`);
        return EXIT.interrupted;
      }
      if (outcome.failed > 0) {
        printProblem('run', `${count(outcome.failed, 'cell')} failed; compute them again with: ${resumeCommand(config, values.out)} --retry-failed`);
        return EXIT.cellsFailed;
      }
      return EXIT.success;
    } finally {
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
    }
  });
}

/** The command that picks the sweep up where it stopped. */
function resumeCommand(config: string, out: string | undefined): string {
  return `crosswise run ${config}${out == null ? '' : ` --out ${out}`}`;
}

/** Builds summary.md, comparisons.csv and the plots; returns where the summary is. */
async function buildSummary(out: string): Promise<string> {
  // Imported on demand: the plotting library takes a moment to load.
  const { buildReport } = await import('../report/build-report.js');
  const files = await buildReport(out);
  return `summary: ${files.summaryPath}${files.warnings.length > 0 ? ` (${files.warnings.length} warnings: ${files.warnings[0]})` : ''}`;
}
