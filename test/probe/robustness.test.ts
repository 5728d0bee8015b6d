import { describe, expect, it } from 'vitest';
import { AREA_MIN_CLEAN, correctedScore, corruptionError, normalisedArea, relativeCorruptionError, seedRobustness, type CurvePoint } from '../../src/probe/robustness.js';

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

  it('names a long clean score rounded to three decimals, not as 17 digits', () => {
    expect(normalisedArea(curve(-0.004014661204202796, 0)).reason).toBe('the clean score -0.004 is not positive');
  });
});

describe('correctedScore', () => {
  it('is Cohen\'s kappa form (p_o − p_e) / (1 − p_e) for accuracy: 0.7 against chance 0.5 gives 0.4 (Cohen 1960, eq. 1; worked by hand)', () => {
    expect(correctedScore('accuracy', 0.7, 0.5)).toBeCloseTo(0.4, 12);
  });

  it('is 0 at chance and 1 at perfect accuracy, whatever the chance level', () => {
    expect(correctedScore('accuracy', 0.8, 0.8)).toBe(0);
    expect(correctedScore('accuracy', 1, 0.8)).toBeCloseTo(1, 12);
  });

  it('floors R² at 0 and keeps positive R² as it is', () => {
    expect(correctedScore('r2', -14.7, NaN)).toBe(0);
    expect(correctedScore('r2', 0.42, NaN)).toBe(0.42);
  });

  it('floors accuracy below chance at 0: 0.1 against chance 0.8 would be −3.5', () => {
    expect(correctedScore('accuracy', 0.1, 0.8)).toBe(0);
  });

  it('is NaN when every training row has the majority class (chance 1)', () => {
    expect(correctedScore('accuracy', 1, 1)).toBeNaN();
  });
});

// A hand-worked two-seed example (numbers invented for the arithmetic, worked in the comments).
describe('seedRobustness per seed', () => {
  it('seed 1, accuracy 0.9, 0.8, 0.6 at chance 0.5 → corrected 0.8, 0.6, 0.2: noisy 0.4, drop 0.4, area (0.7 + 0.4) / (0.8 × 2) = 0.6875', () => {
    const corrected = [0.9, 0.8, 0.6].map((a) => correctedScore('accuracy', a, 0.5));
    const seed1 = seedRobustness(curve(...corrected));
    expect(seed1.noisy.value).toBeCloseTo(0.4, 12);
    expect(seed1.drop.value).toBeCloseTo(0.4, 12);
    expect(seed1.area.value).toBeCloseTo(0.6875, 12);
  });

  it('seed 2, accuracy 0.61, 0.6, 0.55 at chance 0.6 → corrected 0.025, 0, 0 (floored): noisy 0, drop 0.025, area undefined (clean below 0.05)', () => {
    const corrected = [0.61, 0.6, 0.55].map((a) => correctedScore('accuracy', a, 0.6));
    const seed2 = seedRobustness(curve(...corrected));
    expect(seed2.noisy.value).toBe(0);
    expect(seed2.drop.value).toBeCloseTo(0.025, 12);
    expect(seed2.area.value).toBeNaN();
    expect(seed2.area.reason).toBe(`the clean score 0.025 is below ${AREA_MIN_CLEAN}`);
  });

  it('R² 0.5, 0.3, −2 → floored 0.5, 0.3, 0: noisy 0.15, drop 0.35, area (0.4 + 0.15) / (0.5 × 2) = 0.55', () => {
    const figures = seedRobustness(curve(...[0.5, 0.3, -2].map((r2) => correctedScore('r2', r2, NaN))));
    expect(figures.noisy.value).toBeCloseTo(0.15, 12);
    expect(figures.drop.value).toBeCloseTo(0.35, 12);
    expect(figures.area.value).toBeCloseTo(0.55, 12);
  });

  it('is undefined, with the reason, without a noisy severity', () => {
    const figures = seedRobustness(curve(0.5));
    expect(figures.noisy.value).toBeNaN();
    expect(figures.drop.reason).toBe('the curve has no severity beyond 0');
  });
});
