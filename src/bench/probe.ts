import { fileURLToPath } from 'node:url';
import { collect } from '../collect/collector.js';
import { splitByEpisode } from '../collect/split.js';
import { initBackend, trainLearner, type BackendName, type LearnerSpec } from '../learn/index.js';
import { evaluateEncoder } from '../probe/evaluate.js';
import { DEFAULT_SENSE_SETTINGS } from '../senses/channel.js';
import { loadWorld } from '../world/parse.js';

const DEMO_WORLD = fileURLToPath(new URL('../../worlds/greenhouse.yaml', import.meta.url));
const SEED = 1;

/** A quickstart learner: sound from sight, encoder [128, 64] relu, the default training settings. */
const SPEC: LearnerSpec = {
  name: 'bench-probe',
  objective: 'predict',
  input: ['sight'],
  target: ['sound'],
  offset: 0,
  supervisedTargets: [],
  encoder: { hidden: [128, 64], activation: 'relu' },
  rule: 'backprop',
  train: { optimizer: 'adam', learningRate: 0.001, batch: 256, epochs: 10, patience: 3, temperature: 0.1, alignEvery: 50 },
  saveFeatures: false,
};

/**
 * Seconds `evaluateEncoder` takes for one quickstart cell (median of `repeats` after a
 * warm-up): 20 000 greenhouse steps split 0.7/0.15/0.15 by episode, one trained encoder,
 * the quickstart's five targets and sight gaussian noise at severities 0–5. Training
 * happens once, outside the timing.
 */
export async function probeSecondsPerCell(opts: { repeats: number; backend: BackendName }): Promise<number> {
  await initBackend(opts.backend);
  const data = collect(loadWorld(DEMO_WORLD), { policy: 'wander', steps: 20_000, episodeSteps: 200 }, DEFAULT_SENSE_SETTINGS, SEED);
  const split = splitByEpisode(data, { train: 0.7, validation: 0.15, test: 0.15 }, SEED);
  const { encoder } = await trainLearner(SPEC, data, split, { seed: SEED });
  try {
    const evaluate = () => evaluateEncoder({
      encoder, data, split, seed: SEED,
      targets: ['wall_ahead', 'material_ahead', 'nearest_emitter', 'nearest_distance_m', 'heading'],
      noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 1, 2, 3, 4, 5] }],
    });
    evaluate();
    const seconds: number[] = [];
    for (let r = 0; r < opts.repeats; r++) {
      const t0 = performance.now();
      evaluate();
      seconds.push((performance.now() - t0) / 1000);
    }
    return seconds.sort((a, b) => a - b)[Math.floor(seconds.length / 2)];
  } finally {
    encoder.dispose();
  }
}
