/**
 * Robustness figures of one learner's curve (mean score by severity), after Hendrycks &
 * Dietterich 2019 (ICLR), "Benchmarking neural network robustness to common corruptions
 * and perturbations". Severity 0 is the clean score; errors are E = 1 − score.
 */
export interface RobustnessFigures {
  /** Trapezoid area under score(severity) divided by the width of the severity range: the curve's average score. */
  readonly normalisedArea: number;
  /** Clean score minus the score at the highest severity. */
  readonly dropFromClean: number;
  /** Σ_s E_s(learner) / Σ_s E_s(baseline) over severities > 0; NaN when the baseline's sum is 0. */
  readonly ce: number;
  /** Σ_s (E_s − E_0)(learner) / Σ_s (E_s − E_0)(baseline); NaN when the baseline did not degrade (sum ≤ 0). */
  readonly relativeCe: number;
}

/** One point of a robustness curve. */
export interface CurvePoint {
  readonly severity: number;
  readonly score: number;
}

/** Area under the curve (trapezoid rule) over the width of its severity range; NaN for fewer than 2 points. */
export function normalisedArea(curve: readonly CurvePoint[]): number {
  const c = sorted(curve);
  if (c.length < 2) return NaN;
  let area = 0;
  for (let i = 1; i < c.length; i++) area += (c[i].severity - c[i - 1].severity) * (c[i].score + c[i - 1].score) / 2;
  return area / (c[c.length - 1].severity - c[0].severity);
}

/** Clean score (severity 0) minus the score at the highest severity; NaN without a clean point. */
export function dropFromClean(curve: readonly CurvePoint[]): number {
  const c = sorted(curve);
  const clean = c.find((p) => p.severity === 0);
  return clean == null || c.length < 2 ? NaN : clean.score - c[c.length - 1].score;
}

/** Corruption error CE = Σ_{s>0} E_s(learner) / Σ_{s>0} E_s(baseline) (Hendrycks & Dietterich 2019, eq. for CE). */
export function corruptionError(learner: readonly CurvePoint[], baseline: readonly CurvePoint[]): number {
  const severities = shared(learner, baseline);
  const sum = (c: readonly CurvePoint[]): number => severities.reduce((acc, s) => acc + 1 - scoreAt(c, s), 0);
  const denominator = sum(baseline);
  return severities.length === 0 || denominator === 0 ? NaN : sum(learner) / denominator;
}

/** Relative CE = Σ_{s>0} (E_s − E_0)(learner) / Σ_{s>0} (E_s − E_0)(baseline) (Hendrycks & Dietterich 2019). */
export function relativeCorruptionError(learner: readonly CurvePoint[], baseline: readonly CurvePoint[]): number {
  const severities = shared(learner, baseline);
  const hasClean = learner.some((p) => p.severity === 0) && baseline.some((p) => p.severity === 0);
  const sum = (c: readonly CurvePoint[]): number =>
    severities.reduce((acc, s) => acc + (1 - scoreAt(c, s)) - (1 - scoreAt(c, 0)), 0);
  const denominator = sum(baseline);
  return !hasClean || severities.length === 0 || !(denominator > 0) ? NaN : sum(learner) / denominator;
}

/** All four figures of a learner against the baseline's curve. */
export function robustnessFigures(learner: readonly CurvePoint[], baseline: readonly CurvePoint[] | null): RobustnessFigures {
  return {
    normalisedArea: normalisedArea(learner),
    dropFromClean: dropFromClean(learner),
    ce: baseline == null ? NaN : corruptionError(learner, baseline),
    relativeCe: baseline == null ? NaN : relativeCorruptionError(learner, baseline),
  };
}

function sorted(curve: readonly CurvePoint[]): CurvePoint[] {
  return curve.filter((p) => Number.isFinite(p.score)).sort((a, b) => a.severity - b.severity);
}

function scoreAt(curve: readonly CurvePoint[], severity: number): number {
  return curve.find((p) => p.severity === severity)?.score ?? NaN;
}

/** Noisy severities (> 0) where both curves have a finite score. */
function shared(a: readonly CurvePoint[], b: readonly CurvePoint[]): number[] {
  return sorted(a).map((p) => p.severity).filter((s) => s > 0 && Number.isFinite(scoreAt(b, s)));
}
