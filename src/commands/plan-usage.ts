import { defineCommand } from './usage.js';

/** What `crosswise plan` takes and does. */
export const planUsage = defineCommand({
  name: 'plan',
  summary: "list a sweep's cells; runs and writes nothing",
  details: 'One row per cell: its index (for crosswise cell --index), its id (its folder under cells/), learner, seed and vary values; '
    + 'then the size of the primary family of hypotheses and the smallest effect (d_z) its seeds can detect with 80% power.',
  operands: [{ name: 'config', description: 'the sweep config (YAML)' }],
  options: {
    out: { kind: 'text', value: 'DIR', description: 'output folder the sweep would write to', defaultText: "the config's out, else runs/<name> beside the config" },
  },
  examples: ['crosswise plan configs/quickstart.yaml'],
  exitCodes: [0, 1],
  load: async () => (await import('./plan.js')).planCommand,
});
