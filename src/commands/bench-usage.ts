import { BACKENDS } from '../learn/spec.js';
import { defineCommand } from './usage.js';

/** What `crosswise bench` takes and does. */
export const benchUsage = defineCommand({
  name: 'bench',
  summary: 'speed of collection, training and a whole sweep, beside PyTorch when present',
  operands: [],
  options: {
    json: { kind: 'flag', description: 'one JSON object instead of a table' },
    quick: { kind: 'flag', description: 'shorter runs, and no sweep timings (quickstart and peer)' },
    backend: { kind: 'choice', choices: BACKENDS, default: 'wasm', description: 'TensorFlow.js backend of the per-objective and probe figures' },
    repeats: { kind: 'integer', value: 'N', default: 3, min: 1, description: 'timed repeats of each figure after one warm-up; the median is reported with min and max' },
  },
  examples: ['crosswise bench --quick'],
  exitCodes: [0, 1],
  load: async () => (await import('./bench.js')).benchCommand,
});
