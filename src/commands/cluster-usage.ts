import { DEFAULT_MAX_ARRAY_SIZE } from '../experiment/cluster-script.js';
import { defineCommand } from './usage.js';

/** What `crosswise cluster` takes and does. */
export const clusterUsage = defineCommand({
  name: 'cluster',
  summary: 'write a Slurm job-array script for the cells still missing',
  details: 'Writes DIR/array-job.sh: one array task per missing cell (crosswise cell), then the report once every task has ended. '
    + 'Submit it with bash. Cells already done are left out, and failed ones too unless --retry-failed is given; '
    + 'when nothing is missing no script is written. Arrays hold blocks of a power of ten cells, so no task index reaches --max-array-size.',
  operands: [{ name: 'config', description: 'the sweep config (YAML)' }],
  options: {
    out: { kind: 'text', value: 'DIR', required: true, description: 'a folder every cluster node can reach' },
    time: { kind: 'text', value: 'T', description: 'time limit of each task, as sbatch --time takes it (e.g. 2:00:00)', defaultText: "the partition's" },
    mem: { kind: 'text', value: 'M', description: 'memory of each task, as sbatch --mem takes it (e.g. 4G)', defaultText: "the partition's" },
    partition: { kind: 'text', value: 'P', description: 'partition to run in', defaultText: "the cluster's default" },
    account: { kind: 'text', value: 'A', description: 'account to charge', defaultText: 'your default account' },
    'max-parallel': { kind: 'integer', value: 'K', min: 1, description: 'array tasks running at once, across all arrays', defaultText: 'no limit' },
    'max-array-size': { kind: 'integer', value: 'N', min: 1, default: DEFAULT_MAX_ARRAY_SIZE, description: "the cluster's MaxArraySize (scontrol show config): task indices stay below it" },
    'retry-failed': { kind: 'flag', description: 'run cells that failed before again too' },
  },
  examples: [
    'crosswise cluster configs/quickstart.yaml --out /shared/runs/quickstart --time 1:00:00 --mem 4G',
    'bash /shared/runs/quickstart/array-job.sh',
  ],
  exitCodes: [0, 1, 4, 5],
  load: async () => (await import('./cluster.js')).clusterCommand,
});
