import { defineCommand } from './usage.js';

/** What `crosswise cell` takes and does. */
export const cellUsage = defineCommand({
  name: 'cell',
  summary: 'run one cell of a sweep (one task of a cluster job array)',
  details: 'Stores the cell under <out>/cells/ as crosswise run would; a finished cell is left as it is. '
    + 'Build the report with crosswise report once every cell is done.',
  operands: [{ name: 'config', description: 'the sweep config (YAML)' }],
  options: {
    index: { kind: 'integer', value: 'I', min: 0, required: true, description: 'which cell, numbered from 0 as crosswise plan lists them' },
    out: { kind: 'text', value: 'DIR', description: 'output folder', defaultText: "the config's out" },
  },
  examples: ['crosswise cell configs/quickstart.yaml --index 3 --out runs/quickstart'],
  exitCodes: [0, 1, 3, 4, 5],
  load: async () => (await import('./cell.js')).cellCommand,
});
