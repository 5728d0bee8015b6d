import { POLICY_NAMES } from '../collect/policies.js';
import { defineCommand } from './usage.js';

/** What `crosswise listen` takes and does. */
export const listenUsage = defineCommand({
  name: 'listen',
  summary: 'what the agent hears along a walk, as a stereo WAV file',
  details: "Each ear's band levels drive band-limited noise at the band centres: 0.1 s per step, 44.1 kHz, 16-bit PCM, "
    + '100 dB = 0 dBFS. With --config the walk uses that config\'s world and sense settings; with --index too, it is exactly the walk that cell collected. '
    + 'With --replay it is the sound of a recording (crosswise record), as recorded.',
  operands: [{ name: 'world', orOption: ['config', 'replay'], description: 'a world file (YAML)' }],
  options: {
    config: { kind: 'text', value: 'FILE', description: "a sweep config, for its world and sense settings" },
    index: { kind: 'integer', value: 'I', min: 0, description: 'with --config: the walk of this cell, numbered from 0 as crosswise plan lists them' },
    replay: { kind: 'text', value: 'DIR', description: 'a folder written by crosswise record: render its sound' },
    steps: { kind: 'integer', value: 'N', min: 1, description: 'steps to render, 0.1 s each', defaultText: "300, or all of a cell's walk or a recording when shorter" },
    seed: { kind: 'integer', value: 'S', description: 'seed of the walk', defaultText: "1, or the config's first seed" },
    policy: { kind: 'choice', choices: POLICY_NAMES, value: 'P', description: 'how the agent walks', defaultText: "wander, or the config's policy" },
    out: { kind: 'text', value: 'FILE.wav', required: true, description: 'the WAV file to write' },
  },
  examples: [
    'crosswise listen worlds/cave.yaml --steps 200 --out cave.wav',
    'crosswise listen --config configs/quickstart.yaml --index 0 --out cell-0.wav',
    'crosswise listen --replay greenhouse-1 --steps 600 --out greenhouse-1.wav',
  ],
  exitCodes: [0, 1, 5],
  load: async () => (await import('./listen.js')).listenCommand,
});
