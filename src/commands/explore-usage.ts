import { defineCommand } from './usage.js';

/** What `crosswise explore` takes and does. */
export const exploreUsage = defineCommand({
  name: 'explore',
  summary: 'walk a world with every sense drawn live (an interactive terminal app)',
  details: 'The other demo worlds are a key away; press ? inside for the keys. With --replay, step through a recording '
    + '(crosswise record) instead: every panel and the ground truth as recorded, episode starts marked.',
  operands: [{ name: 'world', optional: true, orOption: ['config', 'replay'], description: 'a world file (default: worlds/greenhouse.yaml)' }],
  options: {
    config: { kind: 'text', value: 'FILE', description: "a sweep config, for its world and sense settings" },
    replay: { kind: 'text', value: 'DIR', description: 'a folder written by crosswise record, to step through' },
    seed: { kind: 'integer', value: 'N', default: 1, description: 'seed of the noise shown on the senses' },
  },
  examples: ['crosswise explore worlds/cave.yaml', 'crosswise explore --config configs/quickstart.yaml', 'crosswise explore --replay greenhouse-1'],
  exitCodes: [0, 1],
  load: async () => (await import('./explore.js')).exploreCommand,
});
