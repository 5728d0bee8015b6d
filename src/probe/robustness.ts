/** One point of a robustness curve: the score at a severity (0 = clean). */
export interface CurvePoint {
  readonly severity: number;
  readonly score: number;
}

/** A derived figure; `value` is NaN exactly when `reason` says why it has no meaning. */
export interface Figure {
  readonly value: number;
  readonly reason?: string;
}

const undefinedFigure = (reason: string): Figure => ({ value: NaN, reason });

/**
 * Area under the curve by the trapezoid rule over the measured severities, divided by
 * clean score × severity range: 1 when noise costs nothing, lower as the curve falls
 * (common practice; the trapezoid handles unevenly spaced explicit severities). Needs
 * severity 0 and one more; undefined when the clean score is not positive, because the
 * ratio then has no sign-stable meaning.
 */
export function normalisedArea(curve: readonly CurvePoint[]): Figure {
  const points = sorted(curve);
  const clean = cleanScore(points);
  if (clean === undefined) return undefinedFigure('the curve has no severity 0 (clean) point');
  if (points.length < 2) return undefinedFigure('the curve needs at least one severity beyond 0');
  if (!(clean > 0)) return undefinedFigure(`the clean score ${clean} is not positive`);
  let area = 0;
  for (let i = 1; i < points.length; i++) {
    area += ((points[i].score + points[i - 1].score) / 2) * (points[i].severity - points[i - 1].severity);
  }
  const range = points[points.length - 1].severity - points[0].severity;
  return { value: area / (clean * range) };
}

/** Clean score minus the mean score over the severities above 0 (same units as the score). */
export function dropFromClean(curve: readonly CurvePoint[]): Figure {
  const clean = cleanScore(curve);
  if (clean === undefined) return undefinedFigure('the curve has no severity 0 (clean) point');
  const noisy = curve.filter((p) => p.severity > 0);
  if (noisy.length === 0) return undefinedFigure('the curve has no severity beyond 0');
  return { value: clean - noisy.reduce((sum, p) => sum + p.score, 0) / noisy.length };
}

/**
 * Corruption error relative to a baseline, CE = Σ_s E_s(learner) / Σ_s E_s(baseline)
 * with E = 1 − score, summed over the severities above 0 (Hendrycks & Dietterich 2019,
 * ICLR, §3). Undefined when the baseline makes no error at any severity (a zero
 * denominator), never Infinity.
 */
export function corruptionError(learner: readonly CurvePoint[], baseline: readonly CurvePoint[]): Figure {
  const paired = pairSeverities(learner, baseline);
  let numerator = 0;
  let denominator = 0;
  for (const [l, b] of paired) {
    numerator += 1 - l;
    denominator += 1 - b;
  }
  if (denominator === 0) return undefinedFigure('the baseline has zero error at every severity');
  return { value: numerator / denominator };
}

/**
 * Relative corruption error, Σ_s (E_s − E_clean)(learner) / Σ_s (E_s − E_clean)(baseline)
 * over the severities above 0 (Hendrycks & Dietterich 2019, ICLR, §3): how much error
 * the noise adds, relative to what it adds to the baseline. Undefined when noise adds no
 * error to the baseline in total (a zero denominator), and when it lowers the baseline's
 * error in total (a negative denominator would flip the sign of the comparison).
 */
export function relativeCorruptionError(learner: readonly CurvePoint[], baseline: readonly CurvePoint[]): Figure {
  const paired = pairSeverities(learner, baseline);
  const learnerClean = cleanScore(learner);
  const baselineClean = cleanScore(baseline);
  if (learnerClean === undefined || baselineClean === undefined) return undefinedFigure('both curves need a severity 0 (clean) point');
  let numerator = 0;
  let denominator = 0;
  for (const [l, b] of paired) {
    numerator += (1 - l) - (1 - learnerClean);
    denominator += (1 - b) - (1 - baselineClean);
  }
  if (denominator === 0) return undefinedFigure('noise adds no error to the baseline (zero denominator)');
  if (denominator < 0) return undefinedFigure('noise lowers the baseline error in total (negative denominator)');
  return { value: numerator / denominator };
}

/** Scores of learner and baseline at each severity above 0; both curves must measure the same severities. */
function pairSeverities(learner: readonly CurvePoint[], baseline: readonly CurvePoint[]): [number, number][] {
  const l = sorted(learner).filter((p) => p.severity > 0);
  const b = sorted(baseline).filter((p) => p.severity > 0);
  const same = l.length === b.length && l.every((p, i) => p.severity === b[i].severity);
  if (!same) {
    throw new Error(`learner severities [${l.map((p) => p.severity).join(', ')}] differ from baseline severities [${b.map((p) => p.severity).join(', ')}]`);
  }
  if (l.length === 0) throw new Error('corruption error needs at least one severity beyond 0');
  return l.map((p, i) => [p.score, b[i].score]);
}

function cleanScore(curve: readonly CurvePoint[]): number | undefined {
  return curve.find((p) => p.severity === 0)?.score;
}

function sorted(curve: readonly CurvePoint[]): CurvePoint[] {
  return [...curve].sort((a, b) => a.severity - b.severity);
}
