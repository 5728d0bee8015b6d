import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { compressIndices } from '../experiment/cluster-arrays.js';
import { DEFAULT_MAX_ARRAY_SIZE, clusterCommandLine, quote, recordedCommandLine, SCRIPT_NAME } from '../experiment/cluster-script.js';
import { cellStates, type CellState } from '../results/cell-states.js';
import { outputPath } from '../results/layout.js';
import { readPlan, type Plan } from '../results/plan-table.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { count, printProblem } from './messages.js';
import { statusUsage } from './status-usage.js';

/** `crosswise status`: done, failed and missing cells of an output folder, and how to resubmit (see status-usage.ts). */
export async function statusCommand(args: readonly string[]): Promise<number> {
  return runAction(statusUsage, args, async ({ operands: [dir] }) => {
    const out = resolve(dir);
    let plan: Plan;
    try {
      plan = readPlan(out);
    } catch (error) {
      printProblem('status', (error as Error).message);
      return EXIT.invalidInput;
    }
    const states = cellStates(out, plan.entries.map((entry) => ({ index: entry.index, id: entry.cell })));
    for (const line of statusLines(out, plan, states, resubmitCommand(out))) console.log(line);
    if (states.some((s) => s.status === 'missing')) return EXIT.cellsMissing;
    return states.some((s) => s.status === 'failed') ? EXIT.cellsFailed : EXIT.success;
  });
}

/** The report of `crosswise status`, one line each; `rewrite` is the crosswise cluster command line to use. */
export function statusLines(out: string, plan: Plan, states: readonly CellState[], rewrite: string): string[] {
  const indices = (status: CellState['status']) => states.filter((s) => s.status === status).map((s) => s.index);
  const [done, missing] = [indices('done'), indices('missing')];
  const failed = states.filter((s) => s.status === 'failed');
  const lines = [
    `${out}: ${count(states.length, 'cell')}, ${done.length} done, ${failed.length} failed, ${missing.length} missing`,
    `done     ${compressIndices(done) || 'none'}`,
    ...failed.map(({ index, id, reason }) => `failed   ${index} ${plan.entries[index].learner} seed ${plan.entries[index].seed} (${id}): ${reason}`),
    `missing  ${compressIndices(missing) || 'none'}`,
  ];
  const submit = `bash ${quote(join(out, SCRIPT_NAME))}`;
  if (missing.length > 0) {
    lines.push(`resubmit the ${count(missing.length, 'missing cell')} with:`, `  ${rewrite} && ${submit}`);
    if (failed.length > 0) lines.push(`add --retry-failed to crosswise cluster to run the ${count(failed.length, 'failed cell')} again too`);
  } else if (failed.length > 0) {
    lines.push(`run the ${count(failed.length, 'failed cell')} again with:`, `  ${rewrite} --retry-failed && ${submit}`);
  } else {
    lines.push(`every cell is done; the report: crosswise report ${quote(out)}`);
  }
  return lines;
}

/**
 * The crosswise cluster command line for this folder: the one recorded in its job-array
 * script, with the request settings it was written with, or else one that reads the
 * folder's own config.resolved.yaml (the same plan, so the same cells).
 */
function resubmitCommand(out: string): string {
  const script = join(out, SCRIPT_NAME);
  const recorded = existsSync(script) ? recordedCommandLine(readFileSync(script, 'utf8')) : null;
  return recorded ?? clusterCommandLine(outputPath(out, 'config'), out, {}, DEFAULT_MAX_ARRAY_SIZE);
}
