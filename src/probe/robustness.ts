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

/** Corrected clean scores below this leave the normalised area undefined: a ratio to almost nothing (common practice). */
export const AREA_MIN_CLEAN = 0.05;

/**
 * A probe score on a chance-corrected scale, so that features that carry nothing score 0
 * and cannot look sturdy: accuracy becomes (accuracy − chance) / (1 − chance), the form of
 * Cohen's kappa (Cohen 1960, eq. 1) with chance the majority class's share of the training
 * rows; R² is taken as it is. Both are floored at 0: a read-out fitted on clean features
 * can score far below that on noisy ones (R² of −14, or accuracy so far below a chance of
 * 0.8 that the corrected value is −3.9), and below 0 it measures only how far the read-out
 * extrapolates, not what the features carry. NaN when chance is 1.
 */
export function correctedScore(metric: 'r2' | 'accuracy', score: number, chance: number): number {
  const corrected = metric === 'r2' ? score : chance < 1 ? (score - chance) / (1 - chance) : NaN;
  return Number.isNaN(corrected) ? NaN : Math.max(0, corrected);
}

/** The per-seed robustness measures, in the order every output lists them. */
export const SEED_MEASURES = ['noisy', 'drop', 'area'] as const;
export type SeedMeasure = (typeof SEED_MEASURES)[number];

/** The per-seed robustness measures of one corrected curve. */
export interface SeedRobustness extends Record<SeedMeasure, Figure> {
  /** Mean corrected score over the noisy severities: how much the features still carry under noise. */
  readonly noisy: Figure;
  /** Corrected clean score minus `noisy`: how much the noise took away. */
  readonly drop: Figure;
  /** Normalised area under the corrected curve (normalisedArea); undefined below AREA_MIN_CLEAN. */
  readonly area: Figure;
}

/**
 * noisy, drop and area of one learner, seed, target and noise from its corrected curve
 * (severity 0 and the noisy severities). `noisy` is the per-seed counterpart of the mean
 * corruption error of Hendrycks & Dietterich (2019, ICLR, §3) on an accuracy-like scale.
 */
export function seedRobustness(curve: readonly CurvePoint[]): SeedRobustness {
  const clean = cleanScore(curve);
  const noisyPoints = curve.filter((p) => p.severity > 0);
  const missing = clean === undefined ? 'the curve has no severity 0 (clean) point'
    : noisyPoints.length === 0 ? 'the curve has no severity beyond 0' : '';
  if (clean === undefined || missing !== '') {
    const none = undefinedFigure(missing);
    return { noisy: none, drop: none, area: none };
  }
  const noisy = noisyPoints.reduce((sum, p) => sum + p.score, 0) / noisyPoints.length;
  return { noisy: { value: noisy }, drop: { value: clean - noisy }, area: normalisedArea(curve, AREA_MIN_CLEAN) };
}

/**
 * Area under the curve by the trapezoid rule over the measured severities, divided by
 * clean score × severity range: 1 when noise costs nothing, lower as the curve falls
 * (common practice; the trapezoid handles unevenly spaced explicit severities). Needs
 * severity 0 and one more; undefined when the clean score is not positive (the ratio then
 * has no sign-stable meaning) or below `minClean`.
 */
export function normalisedArea(curve: readonly CurvePoint[], minClean = 0): Figure {
  const points = sorted(curve);
  const clean = cleanScore(points);
  if (clean === undefined) return undefinedFigure('the curve has no severity 0 (clean) point');
  if (points.length < 2) return undefinedFigure('the curve needs at least one severity beyond 0');
  if (!(clean > 0)) return undefinedFigure(`the clean score ${roundedText(clean)} is not positive`);
  if (clean < minClean) return undefinedFigure(`the clean score ${roundedText(clean)} is below ${minClean}`);
  let area = 0;
  for (let i = 1; i < points.length; i++) {
    area += ((points[i].score + points[i - 1].score) / 2) * (points[i].severity - points[i - 1].severity);
  }
  const range = points[points.length - 1].severity - points[0].severity;
  return { value: area / (clean * range) };
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

/** A number for a sentence: three significant decimals, not the 17 digits of a double. */
function roundedText(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toFixed(3))) : String(x);
}

function cleanScore(curve: readonly CurvePoint[]): number | undefined {
  return curve.find((p) => p.severity === 0)?.score;
}

function sorted(curve: readonly CurvePoint[]): CurvePoint[] {
  return [...curve].sort((a, b) => a.severity - b.severity);
}
