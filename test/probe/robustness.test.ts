import { describe, expect, it } from 'vitest';
import { corruptionError, dropFromClean, normalisedArea, relativeCorruptionError, type CurvePoint } from '../../src/probe/robustness.js';

const curve = (...scores: number[]): CurvePoint[] => scores.map((score, severity) => ({ severity, score }));

// A hand-computed example of the definitions in Hendrycks & Dietterich 2019 (ICLR, §3):
// learner 0.9, 0.8, 0.6 and baseline 0.95, 0.7, 0.5 at severities 0, 1, 2.
const learner = curve(0.9, 0.8, 0.6);
const baseline = curve(0.95, 0.7, 0.5);

describe('corruption error', () => {
  it('is Σ E_s(learner) / Σ E_s(baseline) over s ≥ 1: (0.2 + 0.4) / (0.3 + 0.5) = 0.75', () => {
    expect(corruptionError(learner, baseline).value).toBeCloseTo(0.75, 12);
  });

  it('is relative to clean error in the relative form: (0.1 + 0.3) / (0.25 + 0.45) = 4/7', () => {
    expect(relativeCorruptionError(learner, baseline).value).toBeCloseTo(4 / 7, 12);
  });

  it('is NaN with a reason, never Infinity, when the baseline makes no error at all', () => {
    const figure = corruptionError(learner, curve(1, 1, 1));
    expect(figure.value).toBeNaN();
    expect(figure.reason).toBe('the baseline has zero error at every severity');
  });

  it('is NaN with a reason when noise adds no error to the baseline', () => {
    const figure = relativeCorruptionError(learner, curve(0.7, 0.7, 0.7));
    expect(figure.value).toBeNaN();
    expect(figure.reason).toBe('noise adds no error to the baseline (zero denominator)');
  });

  it('is NaN with a reason when noise lowers the baseline error in total', () => {
    expect(relativeCorruptionError(learner, curve(0.7, 0.8, 0.75)).reason).toBe('noise lowers the baseline error in total (negative denominator)');
  });

  it('refuses curves measured at different severities', () => {
    expect(() => corruptionError(learner, curve(0.9, 0.8))).toThrow('learner severities [1, 2] differ from baseline severities [1]');
  });
});

describe('normalisedArea', () => {
  it('is the trapezoid area over clean × range: (0.85 + 0.7) / (0.9 × 2) (hand computed)', () => {
    expect(normalisedArea(learner).value).toBeCloseTo(1.55 / 1.8, 12);
  });

  it('is 1 for a flat curve and handles uneven severities by their spacing', () => {
    expect(normalisedArea(curve(0.5, 0.5, 0.5)).value).toBeCloseTo(1, 12);
    const uneven = [{ severity: 0, score: 1 }, { severity: 1, score: 1 }, { severity: 4, score: 0 }];
    expect(normalisedArea(uneven).value).toBeCloseTo((1 + 1.5) / 4, 12);
  });

  it('is NaN with a reason when the clean score is not positive', () => {
    expect(normalisedArea(curve(-0.1, -0.2)).reason).toBe('the clean score -0.1 is not positive');
  });
});

describe('dropFromClean', () => {
  it('is the clean score minus the mean noisy score: 0.9 − 0.7 = 0.2', () => {
    expect(dropFromClean(learner).value).toBeCloseTo(0.2, 12);
  });

  it('is NaN with a reason without a clean point', () => {
    expect(dropFromClean([{ severity: 1, score: 0.5 }]).reason).toBe('the curve has no severity 0 (clean) point');
  });
});
