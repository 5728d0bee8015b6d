import { BACKENDS } from '../learn/spec.js';
import { defineCommand } from './usage.js';

/** What `crosswise run` takes and does. */
export const runUsage = defineCommand({
  name: 'run',
  summary: 'run every cell of a sweep, then build the report; resumable',
  details: 'Finished cells in the output folder are skipped, so the same command resumes an interrupted sweep; '
    + 'failed cells are skipped too unless --retry-failed is given. '
    + 'The numbers do not depend on --jobs. Ctrl-C lets running cells finish; a second Ctrl-C abandons them.',
  operands: [{ name: 'config', description: 'the sweep config (YAML)' }],
  options: {
    out: { kind: 'text', value: 'DIR', description: 'output folder', defaultText: "the config's out, else runs/<name> beside the config" },
    jobs: { kind: 'integer', value: 'N', min: 1, description: 'cells run at once, each on its own worker thread', defaultText: 'the number of cores' },
    plain: { kind: 'flag', description: 'one line per event instead of the live dashboard', defaultText: 'on when stdout is not a terminal' },
    backend: { kind: 'choice', choices: BACKENDS, description: 'TensorFlow.js backend for training', defaultText: "the config's backend" },
    'retry-failed': { kind: 'flag', description: 'compute failed cells again; each failure record is replaced when its cell finishes' },
    force: { kind: 'flag', description: "take over an output folder that belongs to another experiment or results format, or that another machine's run holds; only this config's cells are then read" },
  },
  examples: ['crosswise run configs/quickstart.yaml --jobs 2'],
  exitCodes: [0, 1, 3, 4, 5, 130],
  load: async () => (await import('./run.js')).runCommand,
});
