import { chmodSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { clusterScript } from '../experiment/cluster-script.js';
import { loadSweepFrom, parseCommand, UsageError, withInputErrors } from '../experiment/command-line.js';
import { planCells } from '../experiment/plan.js';
import { writeFileAtomic } from '../results/atomic-file.js';

const CROSSWISE_BIN = fileURLToPath(new URL('../../bin/crosswise.js', import.meta.url));

/** `crosswise cluster <config> --out DIR`: writes DIR/array-job.sh, a job-array script for a cluster scheduler. */
export async function clusterCommand(args: readonly string[]): Promise<number> {
  return withInputErrors(async () => {
    const { config, values } = parseCommand('cluster', args, { out: { type: 'string' } });
    if (values.out == null) throw new UsageError('crosswise cluster: --out DIR is required (a folder every cluster node can reach)');
    const sweep = loadSweepFrom(config, values.out);
    const cells = planCells(sweep);
    const script = join(sweep.out, 'array-job.sh');
    writeFileAtomic(script, clusterScript(sweep, cells.length, { crosswise: CROSSWISE_BIN, config: sweep.configPath, out: sweep.out }));
    chmodSync(script, 0o755);
    console.log(`wrote ${script} (${cells.length} cells); submit with: bash ${script}`);
    return 0;
  });
}
