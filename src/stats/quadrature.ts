/** Interval halvings always made, so a narrow feature cannot hide between the first five samples. */
const MIN_DEPTH = 6;
/** Interval halvings allowed at most; a 2^-40 share of the range is below any feature we integrate. */
const MAX_DEPTH = 40;

interface Panel {
  readonly a: number;
  readonly b: number;
  readonly fa: number;
  readonly fm: number;
  readonly fb: number;
  /** Simpson's rule on [a, b]: (b − a)/6 · (f(a) + 4 f(m) + f(b)). */
  readonly whole: number;
}

function panel(f: (x: number) => number, a: number, b: number, fa: number, fb: number): Panel {
  const fm = f((a + b) / 2);
  return { a, b, fa, fm, fb, whole: ((b - a) / 6) * (fa + 4 * fm + fb) };
}

function refine(f: (x: number) => number, p: Panel, tolerance: number, depth: number): number {
  const m = (p.a + p.b) / 2;
  const left = panel(f, p.a, m, p.fa, p.fm);
  const right = panel(f, m, p.b, p.fm, p.fb);
  const change = left.whole + right.whole - p.whole;
  const settled = depth >= MIN_DEPTH && Math.abs(change) <= 15 * tolerance;
  if (settled || depth >= MAX_DEPTH) return left.whole + right.whole + change / 15;
  return refine(f, left, tolerance / 2, depth + 1) + refine(f, right, tolerance / 2, depth + 1);
}

/**
 * ∫_a^b f(x) dx by adaptive Simpson quadrature with Richardson's correction (Lyness 1969,
 * J. ACM 16:483–495): a panel is halved until its two halves change the estimate by at most
 * 15 × its share of the absolute `tolerance`.
 */
export function integrate(f: (x: number) => number, a: number, b: number, tolerance: number): number {
  if (!(tolerance > 0)) throw new Error(`integrate: tolerance must be positive, got ${tolerance}`);
  if (!(a <= b)) throw new Error(`integrate: needs a ≤ b, got [${a}, ${b}]`);
  if (a === b) return 0;
  return refine(f, panel(f, a, b, f(a), f(b)), tolerance, 0);
}
