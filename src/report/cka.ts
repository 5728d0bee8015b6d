/**
 * Linear centred kernel alignment between two representations of the same rows
 * (Kornblith et al. 2019, ICML, eq. 5 with linear kernels):
 * CKA(X, Y) = ‖YᵀX‖²_F / (‖XᵀX‖_F · ‖YᵀY‖_F) after centring every column.
 * x is [rows, colsX] and y is [rows, colsY], row-major. NaN when either side is constant.
 */
export function linearCka(x: Float32Array, colsX: number, y: Float32Array, colsY: number): number {
  const rows = x.length / colsX;
  if (!Number.isInteger(rows) || y.length / colsY !== rows) {
    throw new Error(`linearCka: x has ${x.length / colsX} rows of ${colsX}, y has ${y.length / colsY} rows of ${colsY}`);
  }
  const xc = centred(x, rows, colsX);
  const yc = centred(y, rows, colsY);
  const cross = frobeniusSquared(gram(xc, colsX, yc, colsY, rows));
  const selfX = Math.sqrt(frobeniusSquared(gram(xc, colsX, xc, colsX, rows)));
  const selfY = Math.sqrt(frobeniusSquared(gram(yc, colsY, yc, colsY, rows)));
  return selfX === 0 || selfY === 0 ? NaN : cross / (selfX * selfY);
}

/** Columns minus their means, in float64. // [rows, cols] */
function centred(a: Float32Array, rows: number, cols: number): Float64Array {
  const out = Float64Array.from(a);
  for (let j = 0; j < cols; j++) {
    let sum = 0;
    for (let i = 0; i < rows; i++) sum += out[i * cols + j];
    const m = sum / rows;
    for (let i = 0; i < rows; i++) out[i * cols + j] -= m;
  }
  return out;
}

/** aᵀb for a [rows, ca] and b [rows, cb]. // [ca, cb] */
function gram(a: Float64Array, ca: number, b: Float64Array, cb: number, rows: number): Float64Array {
  const out = new Float64Array(ca * cb);
  for (let i = 0; i < rows; i++) {
    for (let p = 0; p < ca; p++) {
      const av = a[i * ca + p];
      if (av === 0) continue;
      for (let q = 0; q < cb; q++) out[p * cb + q] += av * b[i * cb + q];
    }
  }
  return out;
}

function frobeniusSquared(m: Float64Array): number {
  let s = 0;
  for (const v of m) s += v * v;
  return s;
}
