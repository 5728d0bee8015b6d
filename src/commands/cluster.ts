import { chmodSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { clusterScript } from '../experiment/cluster-script.js';
import { planCells } from '../experiment/plan.js';
import { writeFileAtomic } from '../results/atomic-file.js';
import { clusterUsage } from './cluster-usage.js';
import { loadSweepFrom, runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';

const CROSSWISE_BIN = fileURLToPath(new URL('../../bin/crosswise.js', import.meta.url));

/** `crosswise cluster`: writes DIR/array-job.sh, a job-array script for a cluster scheduler (see cluster-usage.ts). */
export async function clusterCommand(args: readonly string[]): Promise<number> {
  return runAction(clusterUsage, args, async ({ operands: [config], values }) => {
    const sweep = loadSweepFrom(config, values.out);
    const cells = planCells(sweep);
    const script = join(sweep.out, 'array-job.sh');
    writeFileAtomic(script, clusterScript(sweep, cells.length, { crosswise: CROSSWISE_BIN, config: sweep.configPath, out: sweep.out }));
    chmodSync(script, 0o755);
    console.log(`wrote ${script} (${cells.length} cells); submit with: bash ${script}`);
    return EXIT.success;
  });
}
