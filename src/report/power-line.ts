import { minimumDetectableDz, seedsNeeded } from '../stats/power.js';

/** The factors of the primary family as a config plans it (before any comparison turns out identical). */
export interface PrimaryFamilyPlan {
  /** Learners that are neither the baseline nor a control. */
  readonly learners: number;
  readonly targets: number;
  readonly noises: number;
}

/** Power the line states (Cohen 1988's convention) and the effect whose seed count it gives. */
const POWER = 0.8;
const ALPHA = 0.05;
const REFERENCE_DZ = 1;

/** The number of hypotheses in a planned primary family. */
export function primaryFamilySize(plan: PrimaryFamilyPlan): number {
  return plan.learners * plan.targets * plan.noises;
}

/** The smallest d_z `seeds` detect with 80% power at Holm's first step over `familySize` hypotheses (NaN below 2 seeds). */
export function detectableDz(familySize: number, seeds: number): number {
  return familySize < 1 ? NaN : minimumDetectableDz({ n: seeds, familySize, alpha: ALPHA, power: POWER }).dz;
}

/**
 * One paragraph on what the primary family can detect: its size and factors, the
 * smallest d_z the seeds detect with 80% power in a two-sided paired t-test at Holm's
 * first step (α = 0.05 / m; Holm 1979, Cohen 1988), and the seeds d_z = 1 would need.
 */
export function powerLine(plan: PrimaryFamilyPlan, seeds: number): string {
  const m = primaryFamilySize(plan);
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  if (m === 0) return 'Power: the primary family is empty: every learner other than the baseline is a control, so every comparison is exploratory.';
  const factors = `${plural(plan.learners, 'learner')} × ${plural(plan.targets, 'target')} × ${plural(plan.noises, 'noise')}`;
  const level = `α = ${ALPHA}/${m}`;
  const needed = seedsNeeded({ dz: REFERENCE_DZ, familySize: m, alpha: ALPHA, power: POWER });
  const forOne = needed.seeds == null ? `d_z = ${REFERENCE_DZ} would need ${needed.note}` : `d_z = ${REFERENCE_DZ} would need ${plural(needed.seeds, 'seed')}`;
  const head = `Power: the primary family has ${m === 1 ? '1 hypothesis' : `${m} hypotheses`} (${factors}).`;
  if (seeds < 2) return `${head} With ${plural(seeds, 'seed')} no paired test is possible; ${forOne}.`;
  const dz = detectableDz(m, seeds);
  return `${head} With ${plural(seeds, 'seed')}, a two-sided paired t-test at Holm's first step (${level}) detects d_z ≥ ${dz.toFixed(2)} with ${POWER * 100}% power; ${forOne}.`;
}
