import { noncentralTSurvival } from './noncentral-t.js';
import { tCritical } from './student-t.js';

/** The significance level of a test that is the first of Holm's steps over a family. */
export interface TestLevel {
  /** Hypotheses in the family: Holm's first step tests at alpha / familySize (Holm 1979). Default 1. */
  readonly familySize?: number;
  /** Family-wise two-sided significance level. Default 0.05. */
  readonly alpha?: number;
}

/** A power target on top of a test level. */
export interface PowerTarget extends TestLevel {
  /** Probability of rejecting when the effect is there. Default 0.8 (Cohen 1988's convention). */
  readonly power?: number;
}

/** The smallest standardised paired effect a number of seeds can detect. */
export interface DetectableEffect {
  /** Smallest d_z detected with the target power; NaN with fewer than 2 seeds. */
  readonly dz: number;
  /** Why dz is NaN: '' when it is defined. */
  readonly note: '' | 'fewer than 2 seeds';
}

/** The number of seeds a paired comparison needs. */
export interface SeedsNeeded {
  /** Smallest number of seeds reaching the target power; null when more than the cap would be needed. */
  readonly seeds: number | null;
  /** Power at `seeds`, or at the cap when seeds is null. */
  readonly power: number;
  /** Why seeds is null: '' when found. */
  readonly note: string;
}

/** Seeds beyond which `seedsNeeded` stops looking (common practice: no sweep runs a thousand seeds). */
export const MAX_SEEDS = 1000;

function testAlpha({ familySize = 1, alpha = 0.05 }: TestLevel): number {
  if (!Number.isInteger(familySize) || familySize < 1) throw new Error(`familySize must be a positive integer, got ${familySize}`);
  if (!(alpha > 0 && alpha < 1)) throw new Error(`alpha must be in (0, 1), got ${alpha}`);
  return alpha / familySize;
}

function targetPower(target: PowerTarget): number {
  const level = testAlpha(target);
  const { power = 0.8 } = target;
  if (!(power > level && power < 1)) throw new Error(`power must be in (${level}, 1) (above the test's level), got ${power}`);
  return power;
}

/**
 * Power of the two-sided paired t-test (Student 1908) with n pairs at level alpha / familySize
 * when the differences have standardised mean d_z: P(|T| > t_crit) with T noncentral t,
 * n − 1 degrees of freedom and noncentrality d_z·√n (Cohen 1988, ch. 2); both tails count.
 */
export function pairedTPower({ n, dz, ...level }: TestLevel & { readonly n: number; readonly dz: number }): number {
  const a = testAlpha(level);
  if (!Number.isInteger(n) || n < 2) throw new Error(`pairedTPower: n must be an integer ≥ 2, got ${n}`);
  if (!Number.isFinite(dz)) throw new Error(`pairedTPower: dz must be finite, got ${dz}`);
  const df = n - 1;
  const critical = tCritical(df, 1 - a);
  const delta = dz * Math.sqrt(n);
  return noncentralTSurvival(critical, df, delta) + noncentralTSurvival(critical, df, -delta);
}

/**
 * The smallest d_z that n seeds detect with the target power in a two-sided paired t-test at
 * Holm's first step (alpha / familySize). Power rises with |d_z|, so bisection finds it.
 */
export function minimumDetectableDz({ n, ...target }: PowerTarget & { readonly n: number }): DetectableEffect {
  const power = targetPower(target);
  if (!Number.isInteger(n) || n < 0) throw new Error(`minimumDetectableDz: n must be a non-negative integer, got ${n}`);
  if (n < 2) return { dz: NaN, note: 'fewer than 2 seeds' };
  const reaches = (dz: number) => pairedTPower({ ...target, n, dz }) >= power;
  let low = 0;
  let high = 1;
  while (!reaches(high)) [low, high] = [high, 2 * high];
  while (high - low > 1e-9 * high) {
    const mid = (low + high) / 2;
    if (reaches(mid)) high = mid;
    else low = mid;
  }
  return { dz: high, note: '' };
}

/**
 * The fewest seeds with which a two-sided paired t-test at Holm's first step detects `dz` with
 * the target power, searched up to `maxSeeds`; beyond it the answer says so instead of searching on.
 */
export function seedsNeeded({ dz, maxSeeds = MAX_SEEDS, ...target }: PowerTarget & { readonly dz: number; readonly maxSeeds?: number }): SeedsNeeded {
  const power = targetPower(target);
  if (!Number.isInteger(maxSeeds) || maxSeeds < 2) throw new Error(`seedsNeeded: maxSeeds must be an integer ≥ 2, got ${maxSeeds}`);
  const powerAt = (n: number) => pairedTPower({ ...target, n, dz });
  const atCap = powerAt(maxSeeds);
  if (atCap < power) return { seeds: null, power: atCap, note: `more than ${maxSeeds} seeds` };
  // Power rises with n: double until it is reached, then bisect (fails at low, reaches at high).
  let low = 1;
  let high = 2;
  while (high < maxSeeds && powerAt(high) < power) [low, high] = [high, Math.min(2 * high, maxSeeds)];
  while (high - low > 1) {
    const mid = Math.floor((low + high) / 2);
    if (powerAt(mid) >= power) high = mid;
    else low = mid;
  }
  return { seeds: high, power: powerAt(high), note: '' };
}
