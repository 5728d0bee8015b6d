import { fileURLToPath } from 'node:url';
import { collect } from '../collect/collector.js';
import { splitByEpisode } from '../collect/split.js';
import { DEFAULTS } from '../experiment/defaults.js';
import { initBackend, trainLearner, type BackendName, type LearnerSpec } from '../learn/index.js';
import { evaluateEncoder } from '../probe/evaluate.js';
import { DEFAULT_SENSE_SETTINGS } from '../senses/channel.js';
import { loadWorld } from '../world/parse.js';

const DEMO_WORLD = fileURLToPath(new URL('../../worlds/greenhouse.yaml', import.meta.url));
const SEED = 1;

/** A quickstart learner: sound from sight, with the default encoder [128, 64] relu and training settings. */
const { alignEvery: _alignEvery, ...TRAIN } = DEFAULTS.learner.train;
const SPEC: LearnerSpec = {
  name: 'bench-probe',
  objective: 'predict',
  input: ['sight'],
  target: ['sound'],
  offset: DEFAULTS.learner.offset,
  supervisedTargets: [],
  encoder: DEFAULTS.learner.encoder,
  rule: DEFAULTS.learner.rule,
  train: TRAIN,
};

/**
 * Seconds `evaluateEncoder` takes for one quickstart cell (median of `repeats` after a
 * warm-up): 20 000 greenhouse steps split 0.7/0.15/0.15 by episode, one trained encoder,
 * the quickstart's five targets and sight gaussian noise at severities 0–5. Training
 * happens once, outside the timing.
 */
export async function probeSecondsPerCell(opts: { repeats: number; backend: BackendName }): Promise<number> {
  await initBackend(opts.backend);
  const { policy, steps, episodeSteps, split: fractions } = DEFAULTS.collect;
  const data = collect(loadWorld(DEMO_WORLD), { policy, steps, episodeSteps }, DEFAULT_SENSE_SETTINGS, SEED);
  const split = splitByEpisode(data, fractions, SEED);
  const { encoder } = await trainLearner(SPEC, data, split, { seed: SEED });
  try {
    const evaluate = () => evaluateEncoder({
      encoder, data, split, seed: SEED,
      targets: DEFAULTS.probe.targets,
      noise: [{ channel: 'sight', kind: 'gaussian', severities: DEFAULTS.severities }],
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
