import { availableParallelism } from 'node:os';
import { PIPELINE_MODULE } from '../experiment/cell-work.js';
import { loadSweepFrom, parseCommand, positiveInteger, UsageError, withInputErrors } from '../experiment/command-line.js';
import type { RunListener } from '../experiment/events.js';
import { plainLogger } from '../experiment/plain-log.js';
import { runSweep } from '../experiment/runner.js';
import type { Sweep } from '../experiment/resolved-config.js';
import { BACKENDS, type BackendName } from '../learn/spec.js';

/** What the caller may plug into `run`: the terminal dashboard, the report, or other cell work. */
export interface RunCommandParts {
  /** Module exporting `cellWork`; the collect–train–probe pipeline unless given. */
  readonly workModule?: string;
  /** A listener that draws the dashboard when stdout is a terminal and --plain is not given. */
  readonly dashboard?: (sweep: Sweep) => RunListener;
  /** Builds the report from an output folder and returns the path of its summary. */
  readonly report?: (out: string) => Promise<string>;
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
    const plain = values.plain === true || !process.stdout.isTTY || parts.dashboard == null;
    const listener = plain ? plainLogger((line) => console.log(line)) : (parts.dashboard as (s: Sweep) => RunListener)(sweep);
    const controller = new AbortController();
    const stop = () => controller.abort();
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
    try {
      const outcome = await runSweep(sweep, {
        jobs,
        workModule: parts.workModule ?? PIPELINE_MODULE,
        listeners: [listener],
        signal: controller.signal,
        ...(parts.report == null ? {} : { report: parts.report }),
      });
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

function backendOption(text: string | undefined): BackendName | undefined {
  if (text == null) return undefined;
  if (!(BACKENDS as readonly string[]).includes(text)) throw new UsageError(`--backend: expected one of ${BACKENDS.join(' | ')}, got '${text}'`);
  return text as BackendName;
}
