import { beforeAll, describe, expect, it } from 'vitest';
import { collect } from '../../src/collect/collector.js';
import { splitByEpisode } from '../../src/collect/split.js';
import { initBackend, trainLearner, type LearnerSpec } from '../../src/learn/index.js';
import { evaluateEncoder, type EvaluationResult } from '../../src/probe/evaluate.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { loadWorld } from '../../src/world/parse.js';

// The end-to-end claims of the probe design on a shipped demo world, at small sizes:
// a learner trained on the latents (an upper bound) must carry more of them than frozen
// random weights (the floor), and corrupting the only channel a learner reads must cost it.
const trained = ['x', 'y', 'heading'] as const;

function spec(name: string, objective: LearnerSpec['objective']): LearnerSpec {
  return {
    name, objective, input: ['sight'], target: [], offset: 0, supervisedTargets: [...trained],
    encoder: { hidden: [64], activation: 'relu' }, rule: 'backprop',
    train: { optimizer: 'adam', learningRate: 0.003, batch: 128, epochs: 8, patience: 8, temperature: 0.1 },
  };
}

describe('probes on the greenhouse world', () => {
  const results: Record<string, EvaluationResult> = {};

  beforeAll(async () => {
    await initBackend('cpu');
    const data = collect(loadWorld('worlds/greenhouse.yaml'), { policy: 'wander', steps: 6000, episodeSteps: 200 }, DEFAULT_SENSE_SETTINGS, 2);
    const split = splitByEpisode(data, { train: 0.7, validation: 0.15, test: 0.15 }, 2);
    for (const objective of ['supervised', 'untrained'] as const) {
      const { encoder } = await trainLearner(spec(objective, objective), data, split, { seed: 2 });
      results[objective] = evaluateEncoder({
        encoder, data, split, targets: trained, seed: 2,
        noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 1, 3, 5] }, { channel: 'sound', kind: 'gaussian', severities: [0, 5] }],
      });
      encoder.dispose();
    }
  });

  const score = (learner: string, target: string, channel: string, severity: number): number =>
    results[learner].rows.find((r) => r.target === target && r.channel === channel && r.severity === severity && r.metric !== 'chance')?.value ?? NaN;

  it('gives supervised features a higher clean score than untrained ones on every trained target', () => {
    for (const target of trained) expect(score('supervised', target, 'sight', 0)).toBeGreaterThan(score('untrained', target, 'sight', 0));
  });

  it('lowers a sight-only learner’s scores as sight noise grows, and leaves them under sound noise', () => {
    for (const target of trained) {
      const curve = [0, 1, 3, 5].map((s) => score('supervised', target, 'sight', s));
      for (let i = 1; i < curve.length; i++) expect(curve[i]).toBeLessThan(curve[i - 1]);
      expect(score('supervised', target, 'sound', 5)).toBe(curve[0]);
    }
  });
});
