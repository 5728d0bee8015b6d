import { POLICY_NAMES } from '../collect/policies.js';
import { defineCommand } from './usage.js';

/** What `crosswise record` takes and does. */
export const recordUsage = defineCommand({
  name: 'record',
  summary: "the agent's experience as NumPy arrays, for use outside crosswise",
  details: 'Writes a new folder: one .npy per channel in its physical units (sight [steps, depth, width, 3], '
    + 'sound [steps, 2, bands] in dB, touch, motor), latents.npy, actions.npy, episodes.npy, split.npy and '
    + 'manifest.json (every file with its shape, dtype and units, and the world, senses, policy and seed). '
    + 'A world is walked as a config with default collect settings would walk it; with --config and --index the '
    + 'folder holds exactly the data that cell collects. --noise corrupts the test steps of a channel the way the '
    + 'probes do, with the same draws.',
  operands: [{ name: 'world', orOption: ['config'], description: 'a world file (YAML)' }],
  options: {
    config: { kind: 'text', value: 'FILE', description: 'a sweep config; record the data of the cell --index names' },
    index: { kind: 'integer', value: 'I', min: 0, description: 'with --config: the cell, numbered from 0 as crosswise plan lists them' },
    seed: { kind: 'integer', value: 'S', defaultText: '1', description: 'seed of the walk and its split' },
    steps: { kind: 'integer', value: 'N', min: 1, defaultText: '20000', description: 'steps to record, in episodes of 200 as a config collects them by default' },
    policy: { kind: 'choice', choices: POLICY_NAMES, value: 'P', defaultText: 'wander', description: 'how the agent walks' },
    noise: {
      kind: 'text', value: 'CHANNEL:KIND:SEVERITY[,...]',
      description: 'corrupt the test steps of a channel as the probes do (e.g. sight:gaussian:3); one entry per channel',
    },
    out: { kind: 'text', value: 'DIR', required: true, description: 'the folder to create (it must not exist yet)' },
  },
  examples: [
    'crosswise record worlds/greenhouse.yaml --seed 1 --out greenhouse-1',
    'crosswise record --config configs/quickstart.yaml --index 0 --noise sight:gaussian:3 --out cell-0',
  ],
  exitCodes: [0, 1, 5],
  load: async () => (await import('./record.js')).recordCommand,
});
