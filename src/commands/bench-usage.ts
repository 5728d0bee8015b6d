import { BACKENDS } from '../learn/spec.js';
import { defineCommand } from './usage.js';

/** What `crosswise bench` takes and does. */
export const benchUsage = defineCommand({
  name: 'bench',
  summary: 'speed of collection, training and a whole sweep, beside PyTorch when present',
  operands: [],
  options: {
    json: { kind: 'flag', description: 'one JSON object instead of a table' },
    quick: { kind: 'flag', description: 'shorter runs, and no sweep timing' },
    backend: { kind: 'choice', choices: BACKENDS, default: 'wasm', description: 'TensorFlow.js backend for the training figures' },
  },
  examples: ['crosswise bench --quick'],
  exitCodes: [0, 1],
  load: async () => (await import('./bench.js')).benchCommand,
});
