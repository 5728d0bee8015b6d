import { defineCommand } from './usage.js';

/** What `crosswise cell` takes and does. */
export const cellUsage = defineCommand({
  name: 'cell',
  summary: 'run one cell of a sweep (one task of a cluster job array)',
  details: 'Stores the cell under <out>/cells/ as crosswise run would; a done cell is left as it is, and a failed one '
    + 'too unless --retry-failed is given. Takes no lock on the folder: array tasks on many nodes share it, and each '
    + 'cell is stored at once by a rename. Build the report with crosswise report once every cell has ended.',
  operands: [{ name: 'config', description: 'the sweep config (YAML)' }],
  options: {
    index: { kind: 'integer', value: 'I', min: 0, required: true, description: 'which cell, numbered from 0 as crosswise plan lists them' },
    out: { kind: 'text', value: 'DIR', description: 'output folder', defaultText: "the config's out, else runs/<name> beside the config" },
    'retry-failed': { kind: 'flag', description: 'run the cell again if it failed before' },
  },
  examples: ['crosswise cell configs/quickstart.yaml --index 3 --out runs/quickstart'],
  exitCodes: [0, 1, 3, 4, 5],
  load: async () => (await import('./cell.js')).cellCommand,
});
