import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../src/random.js';

describe('createRng', () => {
  it('reproduces the same stream from the same seed and name', () => {
    const a = createRng(7, 'collect');
    const b = createRng(7, 'collect');
    for (let i = 0; i < 100; i++) expect(a()).toBe(b());
  });

  it('gives independent streams for different names of one seed', () => {
    const a = createRng(7, 'collect');
    const b = createRng(7, 'split');
    expect(a()).not.toBe(b());
  });

  it('treats seed 0 as a seed, not as missing', () => {
    expect(createRng(0, 'x')()).toBe(createRng(0, 'x')());
    expect(createRng(0, 'x')()).not.toBe(createRng(1, 'x')());
  });

  it('rejects a fractional seed with a message naming it', () => {
    expect(() => createRng(1.5)).toThrow('seed must be an integer, got 1.5');
  });
});

describe('normal', () => {
  it('has mean 0 and variance 1 within sampling error (N = 20000, 5 standard errors)', () => {
    const rng = createRng(3, 'normal-test');
    const n = 20000;
    let sum = 0;
    let sumSq = 0;
    for (let i = 0; i < n; i++) {
      const z = normal(rng);
      sum += z;
      sumSq += z * z;
    }
    const mean = sum / n;
    const variance = sumSq / n - mean * mean;
    // Standard error of the mean is 1/sqrt(n); of the variance about sqrt(2/n) for a normal.
    expect(Math.abs(mean)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(variance - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
  });
});
