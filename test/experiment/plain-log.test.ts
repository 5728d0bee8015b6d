import { describe, expect, it } from 'vitest';
import { plainLine } from '../../src/experiment/plain-log.js';

describe('the plain line logger', () => {
  it('counts cells and jobs in the singular for one and the plural otherwise', () => {
    const start = { type: 'sweep-start', name: 'shed', out: '/runs/shed', skipped: 0 } as const;
    expect(plainLine({ ...start, total: 1, jobs: 1 }, 1)).toBe('sweep shed: writing to /runs/shed; 1 cell, 0 already finished, 1 job');
    expect(plainLine({ ...start, total: 15, jobs: 2 }, 15)).toBe('sweep shed: writing to /runs/shed; 15 cells, 0 already finished, 2 jobs');
  });

  it('ends an epoch line with a spiking learner\'s firing rate and silent share per hidden layer', () => {
    const cell = { index: 0, id: 'c0', learner: 'spiking-sound-from-sight', seed: 1, vary: {} };
    const log = { epoch: 2, trainLoss: 0.5, validationLoss: 0.625, seconds: 1, alignmentDeg: [80.25, 0], firing: { rateHz: [152.4, 97.6], silentFraction: [0, 0.0625] } };
    expect(plainLine({ type: 'epoch', cell, worker: 1, log }, 4)).toBe(
      '[1/4] spiking-sound-from-sight seed 1 (c0) epoch 2 train loss 0.5000 validation loss 0.6250 alignment 80.3° 0.0° firing 152/98 Hz silent 0%/6%');
  });
});
