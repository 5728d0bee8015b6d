import { defineCommand } from './usage.js';

/** What `crosswise cluster` takes and does. */
export const clusterUsage = defineCommand({
  name: 'cluster',
  summary: 'write a job-array script for a cluster scheduler (Slurm)',
  details: 'Writes DIR/array-job.sh: one array task per cell (crosswise cell), then the report once every task has finished. Submit it with bash.',
  operands: [{ name: 'config', description: 'the sweep config (YAML)' }],
  options: {
    out: { kind: 'text', value: 'DIR', required: true, description: 'a folder every cluster node can reach' },
  },
  examples: ['crosswise cluster configs/quickstart.yaml --out /shared/runs/quickstart'],
  exitCodes: [0, 1, 5],
  load: async () => (await import('./cluster.js')).clusterCommand,
});
