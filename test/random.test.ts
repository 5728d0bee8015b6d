import { describe, expect, it } from 'vitest';
import { createRng, normal, permutation } from '../src/random.js';

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

describe('permutation', () => {
  it('swaps entry i with entry floor(u·(i + 1)) from the top down (Durstenfeld 1964), worked by hand', () => {
    // n = 4 with draws u = 0.5, 0.9, 0.2: i = 3 swaps with floor(2) = 2 → [0, 1, 3, 2];
    // i = 2 swaps with floor(2.7) = 2 → unchanged; i = 1 swaps with floor(0.4) = 0 → [1, 0, 3, 2].
    const draws = [0.5, 0.9, 0.2];
    const scripted = (): number => draws.shift() ?? NaN;
    expect(Array.from(permutation(4, scripted))).toEqual([1, 0, 3, 2]);
    expect(draws).toEqual([]);
  });

  it('gives each of the 6 orders of 3 items equally often (N = 6000, within 5 standard errors)', () => {
    // Count per order is Binomial(6000, 1/6): mean 1000, sd √(6000·(1/6)·(5/6)) = 28.9.
    const rng = createRng(11, 'permutation-test');
    const counts = new Map<string, number>();
    for (let k = 0; k < 6000; k++) {
      const key = Array.from(permutation(3, rng)).join('');
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
    expect(counts.size).toBe(6);
    for (const count of counts.values()) expect(Math.abs(count - 1000)).toBeLessThan(5 * 28.9);
  });

  it('gives the empty and the one-item permutation without drawing', () => {
    const never = (): number => { throw new Error('drew'); };
    expect(Array.from(permutation(0, never))).toEqual([]);
    expect(Array.from(permutation(1, never))).toEqual([0]);
  });
});
