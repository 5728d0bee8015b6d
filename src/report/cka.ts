/**
 * Linear centred kernel alignment between two representations of the same rows
 * (Kornblith et al. 2019, ICML, eq. 5 with linear kernels):
 * CKA(X, Y) = ‖YᵀX‖²_F / (‖XᵀX‖_F · ‖YᵀY‖_F) after centring every column.
 * x is [rows, colsX] and y is [rows, colsY], row-major. NaN when either side is constant.
 */
export function linearCka(x: Float32Array, colsX: number, y: Float32Array, colsY: number): number {
  const rowsX = x.length / colsX;
  if (!Number.isInteger(rowsX) || y.length / colsY !== rowsX) {
    throw new Error(`linearCka: x has ${rowsX} rows of ${colsX}, y has ${y.length / colsY} rows of ${colsY}`);
  }
  return linearCkaPrepared(prepareCka(x, colsX), prepareCka(y, colsY));
}

/** A representation centred once, with its ‖XᵀX‖_F, for comparing it with many others. */
export interface CkaOperand {
  readonly centred: Float64Array; // [rows, cols]
  readonly rows: number;
  readonly cols: number;
  readonly selfNorm: number;
}

/** Centres x [rows, cols] and computes ‖XᵀX‖_F once. */
export function prepareCka(x: Float32Array, cols: number): CkaOperand {
  const rows = x.length / cols;
  const centredX = centred(x, rows, cols);
  return { centred: centredX, rows, cols, selfNorm: Math.sqrt(frobeniusSquared(gram(centredX, cols, centredX, cols, rows))) };
}

/** Linear CKA of two prepared representations of the same rows; NaN when either is constant. */
export function linearCkaPrepared(a: CkaOperand, b: CkaOperand): number {
  if (a.rows !== b.rows) throw new Error(`linearCka: x has ${a.rows} rows of ${a.cols}, y has ${b.rows} rows of ${b.cols}`);
  if (a.selfNorm === 0 || b.selfNorm === 0) return NaN;
  return frobeniusSquared(gram(a.centred, a.cols, b.centred, b.cols, a.rows)) / (a.selfNorm * b.selfNorm);
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
