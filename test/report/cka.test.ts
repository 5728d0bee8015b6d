import { describe, expect, it } from 'vitest';
import { createRng, normal } from '../../src/random.js';
import { linearCka } from '../../src/report/cka.js';

// Invariances of linear CKA stated by Kornblith et al. 2019 (ICML), section 3:
// invariant to orthogonal transforms and isotropic scaling, not to general invertible maps.
const rows = 50;
const cols = 3;
const rng = createRng(4, 'cka-test');
const x = Float32Array.from({ length: rows * cols }, () => normal(rng)); // [rows, 3]

function times(a: Float32Array, m: readonly number[][]): Float32Array {
  const out = new Float32Array(rows * m[0].length);
  for (let i = 0; i < rows; i++) {
    for (let q = 0; q < m[0].length; q++) {
      let s = 0;
      for (let p = 0; p < cols; p++) s += a[i * cols + p] * m[p][q];
      out[i * m[0].length + q] = s;
    }
  }
  return out;
}

describe('linearCka', () => {
  it('is 1 for a representation with itself', () => {
    expect(linearCka(x, cols, x, cols)).toBeCloseTo(1, 6);
  });

  it('is 1 after an orthogonal transform (a rotation by 30° in the first two axes)', () => {
    const c = Math.cos(Math.PI / 6);
    const s = Math.sin(Math.PI / 6);
    expect(linearCka(x, cols, times(x, [[c, -s, 0], [s, c, 0], [0, 0, 1]]), cols)).toBeCloseTo(1, 5);
  });

  it('is 1 after isotropic scaling', () => {
    expect(linearCka(x, cols, x.map((v) => 2.5 * v), cols)).toBeCloseTo(1, 6);
  });

  it('is below 1 after a generic invertible linear map', () => {
    const value = linearCka(x, cols, times(x, [[5, 0, 0], [1, 0.2, 0], [0, 0, 1]]), cols);
    expect(value).toBeLessThan(0.99);
    expect(value).toBeGreaterThan(0);
  });

  it('compares representations of different widths and is NaN for a constant one', () => {
    expect(linearCka(x, cols, times(x, [[1, 0], [0, 1], [0, 0]]), 2)).toBeLessThan(1);
    expect(linearCka(x, cols, new Float32Array(rows * 2).fill(3), 2)).toBeNaN();
  });

  it('rejects representations with different row counts', () => {
    expect(() => linearCka(x, cols, new Float32Array(10), 2)).toThrow('linearCka: x has 50 rows of 3, y has 5 rows of 2');
  });
});
