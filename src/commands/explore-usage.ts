import { defineCommand } from './usage.js';

/** What `crosswise explore` takes and does. */
export const exploreUsage = defineCommand({
  name: 'explore',
  summary: 'walk a world with every sense drawn live (an interactive terminal app)',
  details: 'The other demo worlds are a key away; press ? inside for the keys.',
  operands: [{ name: 'world', optional: true, orOption: 'config', description: 'a world file (default: worlds/greenhouse.yaml)' }],
  options: {
    config: { kind: 'text', value: 'FILE', description: "a sweep config, for its world and sense settings" },
    seed: { kind: 'integer', value: 'N', default: 1, description: 'seed of the noise shown on the senses' },
  },
  examples: ['crosswise explore worlds/cave.yaml', 'crosswise explore --config configs/quickstart.yaml'],
  exitCodes: [0, 1],
  load: async () => (await import('./explore.js')).exploreCommand,
});
