import { describe, expect, it } from 'vitest';
import { plainLine } from '../../src/experiment/plain-log.js';

describe('the plain line logger', () => {
  it('counts cells and jobs in the singular for one and the plural otherwise', () => {
    const start = { type: 'sweep-start', name: 'shed', out: '/runs/shed', skipped: 0 } as const;
    expect(plainLine({ ...start, total: 1, jobs: 1 }, 1)).toBe('sweep shed: writing to /runs/shed; 1 cell, 0 already finished, 1 job');
    expect(plainLine({ ...start, total: 15, jobs: 2 }, 15)).toBe('sweep shed: writing to /runs/shed; 15 cells, 0 already finished, 2 jobs');
  });
});
