import { chmodSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { arrayBlocks, compressIndices } from '../experiment/cluster-arrays.js';
import { requestProblem, type ClusterRequest } from '../experiment/cluster-request.js';
import { clusterScript, quote, SCRIPT_NAME } from '../experiment/cluster-script.js';
import { planCells } from '../experiment/plan.js';
import { prepareOutput } from '../experiment/runner.js';
import { writeFileAtomic } from '../results/atomic-file.js';
import { cellStates } from '../results/cell-states.js';
import { clusterUsage } from './cluster-usage.js';
import { loadSweepFrom, runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { count, printProblem } from './messages.js';
import { UsageError } from './usage.js';

const CROSSWISE_BIN = fileURLToPath(new URL('../../bin/crosswise.js', import.meta.url));

/** `crosswise cluster`: writes DIR/array-job.sh for the cells still missing (see cluster-usage.ts). */
export async function clusterCommand(args: readonly string[]): Promise<number> {
  return runAction(clusterUsage, args, async ({ operands: [config], values }) => {
    const request: ClusterRequest = { time: values.time, mem: values.mem, partition: values.partition, account: values.account, maxParallel: values['max-parallel'] };
    for (const setting of ['time', 'mem', 'partition', 'account'] as const) {
      const value = request[setting];
      const problem = value == null ? null : requestProblem(setting, value);
      if (problem != null) throw new UsageError(problem);
    }
    const sweep = loadSweepFrom(config, values.out);
    const planned = planCells(sweep);
    const states = cellStates(sweep.out, planned);
    const [done, failed, missing] = (['done', 'failed', 'missing'] as const).map((status) => states.filter((s) => s.status === status).map((s) => s.index));
    const toRun = values['retry-failed'] ? [...failed, ...missing].sort((a, b) => a - b) : missing;
    console.log(`${count(states.length, 'cell')}: ${done.length} done, ${failed.length} failed, ${missing.length} missing`);
    if (failed.length > 0 && !values['retry-failed']) console.log(`left out: ${count(failed.length, 'failed cell')} (${compressIndices(failed)}); add --retry-failed to include failed cells`);
    if (toRun.length === 0) {
      console.log('nothing to submit: no script written');
      return EXIT.success;
    }
    prepareOutput(sweep, false, (line) => printProblem('cluster', `warning: ${line}`));
    const blocks = arrayBlocks(toRun, values['max-array-size']);
    const script = join(sweep.out, SCRIPT_NAME);
    writeFileAtomic(script, clusterScript({
      name: sweep.name,
      cellCount: planned.length,
      blocks,
      maxArraySize: values['max-array-size'],
      request,
      retryFailed: values['retry-failed'],
      paths: { node: process.execPath, crosswise: CROSSWISE_BIN, config: sweep.configPath, out: sweep.out },
    }));
    chmodSync(script, 0o755);
    console.log(`wrote ${script}: ${count(toRun.length, 'cell')} to run (${compressIndices(toRun)}) in ${count(blocks.length, 'job array')}`);
    console.log(`submit with: bash ${quote(script)}`);
    return EXIT.success;
  });
}
