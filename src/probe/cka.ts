/**
 * Linear centered kernel alignment between two representations of the same n rows
 * (Kornblith et al. 2019, ICML, eq. for linear CKA):
 * CKA = ‖YᵀX‖²_F / (‖XᵀX‖_F · ‖YᵀY‖_F), columns centred first, sums in float64.
 * 1 means the two differ only by an orthogonal map and a scale; NaN when either side is
 * constant (a zero denominator: no variance to compare).
 */
export function linearCka(
  X: Float32Array, // [n, dx]
  Y: Float32Array, // [n, dy]
  n: number,
  dx: number,
  dy: number,
): number {
  if (n < 1 || X.length !== n * dx || Y.length !== n * dy) {
    throw new Error(`linearCka: expected X ${n}×${dx} and Y ${n}×${dy}, got ${X.length} and ${Y.length} values`);
  }
  const x = centredColumns(X, n, dx);
  const y = centredColumns(Y, n, dy);
  const cross = frobeniusSquaredOfProduct(y, x, n, dy, dx);
  const denominator = Math.sqrt(frobeniusSquaredOfProduct(x, x, n, dx, dx)) * Math.sqrt(frobeniusSquaredOfProduct(y, y, n, dy, dy));
  return denominator === 0 ? NaN : cross / denominator;
}

function centredColumns(values: Float32Array, n: number, d: number): Float64Array {
  const mean = new Float64Array(d);
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) mean[j] += values[i * d + j];
  for (let j = 0; j < d; j++) mean[j] /= n;
  return Float64Array.from(values, (v, p) => v - mean[p % d]);
}

/** ‖AᵀB‖²_F for A [n, da] and B [n, db]. */
function frobeniusSquaredOfProduct(a: Float64Array, b: Float64Array, n: number, da: number, db: number): number {
  const product = new Float64Array(da * db);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < da; j++) {
      const v = a[i * da + j];
      if (v === 0) continue;
      const row = j * db;
      for (let k = 0; k < db; k++) product[row + k] += v * b[i * db + k];
    }
  }
  let sum = 0;
  for (const v of product) sum += v * v;
  return sum;
}
