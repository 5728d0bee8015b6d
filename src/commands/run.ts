import { availableParallelism } from 'node:os';
import { PIPELINE_MODULE } from '../experiment/cell-work.js';
import { loadSweepFrom, parseCommand, positiveInteger, UsageError, withInputErrors } from '../experiment/command-line.js';
import type { RunEvent, RunListener } from '../experiment/events.js';
import { plainLogger } from '../experiment/plain-log.js';
import { planCells } from '../experiment/plan.js';
import { runSweep } from '../experiment/runner.js';
import { BACKENDS, type BackendName } from '../learn/spec.js';

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
  readonly dashboard?: (hooks: DashboardHooks) => { waitUntilExit(): Promise<void> };
}

const OPTIONS = { out: { type: 'string' }, jobs: { type: 'string' }, plain: { type: 'boolean' }, backend: { type: 'string' } } as const;

/** `crosswise run <config> [--out DIR] [--jobs N] [--plain] [--backend wasm|cpu]`: the whole sweep, resumable. */
export async function runCommand(args: readonly string[], parts: RunCommandParts = {}): Promise<number> {
  return withInputErrors(async () => {
    const { config, values } = parseCommand('run', args, OPTIONS);
    const jobs = positiveInteger('jobs', values.jobs, availableParallelism());
    const backend = backendOption(values.backend);
    const loaded = loadSweepFrom(config, values.out);
    const sweep = backend == null ? loaded : { ...loaded, backend };
    const controller = new AbortController();
    const abandon = new AbortController();
    // The first Ctrl-C lets running cells finish; a second one abandons them (nothing half-written either way).
    const stop = () => {
      if (controller.signal.aborted) abandon.abort();
      else if (dashboard == null) console.log('stopping: running cells finish first (Ctrl-C again to abandon them)');
      controller.abort();
    };
    const listeners = new Set<RunListener>();
    const useDashboard = values.plain !== true && process.stdout.isTTY && parts.dashboard != null;
    const dashboard = useDashboard
      ? parts.dashboard?.({ name: sweep.name, total: planCells(sweep).length, subscribe: (l) => { listeners.add(l); return () => listeners.delete(l); }, onStop: stop })
      : undefined;
    if (dashboard == null) listeners.add(plainLogger((line) => console.log(line)));
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
      });
      await dashboard?.waitUntilExit();
      if (outcome.interrupted) {
        console.log(`stopped; finished cells are kept. resume with: crosswise run ${config}${values.out == null ? '' : ` --out ${values.out}`}`);
        return 130;
      }
      return outcome.failed > 0 ? 3 : 0;
    } finally {
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
    }
  });
}

/** Builds summary.md, comparisons.csv and the plots; returns where the summary is. */
async function buildSummary(out: string): Promise<string> {
  // Imported on demand: the plotting library takes a moment to load.
  const { buildReport } = await import('../report/build-report.js');
  const files = await buildReport(out).catch((error: unknown) => error as Error);
  if (files instanceof Error) return `the report could not be built: ${files.message}`;
  return `summary: ${files.summaryPath}${files.warnings.length > 0 ? ` (${files.warnings.length} warnings: ${files.warnings[0]})` : ''}`;
}

function backendOption(text: string | undefined): BackendName | undefined {
  if (text == null) return undefined;
  if (!(BACKENDS as readonly string[]).includes(text)) throw new UsageError(`--backend: expected one of ${BACKENDS.join(' | ')}, got '${text}'`);
  return text as BackendName;
}
