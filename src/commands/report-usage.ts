import { defineCommand } from './usage.js';

/** What `crosswise report` takes and does. */
export const reportUsage = defineCommand({
  name: 'report',
  summary: 'rebuild summary.md, comparisons.csv and the plots from stored results',
  details: 'Reads only the stored cells, so it writes the same files, byte for byte, as the run that stored them.',
  operands: [{ name: 'DIR', description: 'the output folder of a sweep' }],
  options: {},
  examples: ['crosswise report runs/quickstart'],
  exitCodes: [0, 1, 4, 5],
  load: async () => (await import('./report.js')).reportCommand,
});
