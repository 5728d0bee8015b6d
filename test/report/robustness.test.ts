import { describe, expect, it } from 'vitest';
import {
  corruptionError, dropFromClean, normalisedArea, relativeCorruptionError, robustnessFigures,
} from '../../src/report/robustness.js';

const curve = (scores: readonly number[]) => scores.map((score, severity) => ({ severity, score }));

describe('robustness figures (Hendrycks & Dietterich 2019)', () => {
  // Hand example: learner 0.9, 0.8, 0.6; baseline 0.9, 0.6, 0.4 at severities 0, 1, 2.
  const learner = curve([0.9, 0.8, 0.6]);
  const baseline = curve([0.9, 0.6, 0.4]);

  it('normalised area is the trapezoid area over the severity width', () => {
    // ((0.9 + 0.8) / 2 + (0.8 + 0.6) / 2) / 2 = (0.85 + 0.7) / 2 = 0.775 (by hand).
    expect(normalisedArea(learner)).toBeCloseTo(0.775, 12);
  });

  it('drop from clean is the clean score minus the score at the highest severity', () => {
    expect(dropFromClean(learner)).toBeCloseTo(0.3, 12);
  });

  it('CE sums errors over noisy severities only', () => {
    // Learner E = 0.2 + 0.4 = 0.6, baseline E = 0.4 + 0.6 = 1.0 → CE = 0.6 (by hand).
    expect(corruptionError(learner, baseline)).toBeCloseTo(0.6, 12);
  });

  it('relative CE subtracts each curve\'s clean error', () => {
    // Learner (0.2 − 0.1) + (0.4 − 0.1) = 0.4; baseline (0.4 − 0.1) + (0.6 − 0.1) = 0.8 → 0.5 (by hand).
    expect(relativeCorruptionError(learner, baseline)).toBeCloseTo(0.5, 12);
  });

  it('is NaN, not Infinity, when the baseline never errs or never degrades', () => {
    const perfect = curve([1, 1, 1]);
    expect(corruptionError(learner, perfect)).toBeNaN();
    expect(relativeCorruptionError(learner, curve([0.7, 0.7, 0.7]))).toBeNaN();
  });

  it('leaves CE and relative CE undefined without a baseline', () => {
    const f = robustnessFigures(learner, null);
    expect(f.ce).toBeNaN();
    expect(f.relativeCe).toBeNaN();
    expect(f.normalisedArea).toBeCloseTo(0.775, 12);
  });
});
