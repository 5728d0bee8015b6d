import { beforeAll, describe, expect, it } from 'vitest';
import { collect } from '../../src/collect/collector.js';
import { splitByEpisode } from '../../src/collect/split.js';
import { initBackend, trainLearner } from '../../src/learn/index.js';
import { OBJECTIVES } from '../../src/learn/spec.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { loadWorld } from '../../src/world/parse.js';
import { learnerSpec } from './synthetic.js';

beforeAll(() => initBackend('wasm'));

// A small collection from the greenhouse demo world at the default sense sizes.
const data = collect(loadWorld('worlds/greenhouse.yaml'), { policy: 'wander', steps: 1500, episodeSteps: 100 }, DEFAULT_SENSE_SETTINGS, 3);
const split = splitByEpisode(data, { train: 0.6, validation: 0.2, test: 0.2 }, 3);

describe('on data collected from a demo world', () => {
  it.each(OBJECTIVES.filter((o) => o !== 'untrained'))('%s lowers its training loss', async (objective) => {
    // The two product questions (sound from sight, next touch from sight + motor) and the baselines.
    const cross = objective === 'predict'
      ? { input: ['sight', 'motor'] as const, target: ['touch'] as const, offset: 1 as const }
      : { input: ['sight'] as const, target: ['sound'] as const, offset: 0 as const };
    const spec = learnerSpec({
      objective, input: [...cross.input], target: [...cross.target], offset: cross.offset,
      supervisedTargets: ['wall_ahead', 'heading', 'nearest_distance_m'],
      encoder: { hidden: [32, 16], activation: 'relu' },
      train: { batch: 64, epochs: 5, learningRate: 0.003 },
    });
    const { encoder, log } = await trainLearner(spec, data, split, { seed: 3 });
    encoder.dispose();
    // Common practice: a working training signal lowers the loss by > 10 % in a few epochs.
    expect(log[log.length - 1].trainLoss).toBeLessThan(0.9 * log[0].trainLoss);
    expect(log.every((l) => Number.isFinite(l.validationLoss))).toBe(true);
  });

  it('predict sound from sight lowers its loss too', async () => {
    const spec = learnerSpec({ encoder: { hidden: [32, 16], activation: 'relu' }, train: { batch: 64, epochs: 5, learningRate: 0.003 } });
    const { encoder, log } = await trainLearner(spec, data, split, { seed: 3 });
    encoder.dispose();
    expect(log[log.length - 1].trainLoss).toBeLessThan(0.9 * log[0].trainLoss);
  });
});
