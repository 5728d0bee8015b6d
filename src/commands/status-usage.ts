import { defineCommand } from './usage.js';

/** What `crosswise status` takes and does. */
export const statusUsage = defineCommand({
  name: 'status',
  summary: 'list finished, failed and missing cells, and how to resubmit',
  details: 'Reads only the output folder (its plan.csv and each cell.json): done and missing cells by index, '
    + 'each failed cell with its reason, and the command that writes and submits a job-array script for the missing ones. '
    + 'A missing cell has not been stored yet: it has not run, is still running, or its task was lost.',
  operands: [{ name: 'DIR', description: 'the output folder of a sweep' }],
  options: {},
  examples: ['crosswise status /shared/runs/quickstart'],
  exitCodes: [0, 1, 2, 3],
  load: async () => (await import('./status.js')).statusCommand,
});
