import { SEED_MEASURES, type SeedMeasure } from '../probe/robustness.js';
import { holm } from '../stats/holm.js';
import { pairedComparison, type PairedComparison } from '../stats/paired.js';
import type { ComparisonRow, Family } from '../results/comparisons-table.js';
import type { Measure, ScoreRow } from '../results/results-table.js';
import { bySeed, scoreGroups, severities, unique, type Combination, type ScoreGroup } from './groups.js';

/** One learner against the baseline at one target and noise, on one score severity or one per-seed measure, paired by seed. */
export interface Comparison extends PairedComparison, ComparisonRow {
  readonly combination: number;
}

/** What decides a comparison's family. */
export interface FamilyRules {
  readonly baseline: string;
  /** The per-seed measure of the primary family. */
  readonly primary: SeedMeasure;
  /** Learners compared in the exploratory family only (controls). */
  readonly controls: ReadonlySet<string>;
}

/** What one comparison pairs: per seed, the learner's and the baseline's value. */
interface Pairing {
  readonly severity: number | null;
  readonly measure: Measure;
  readonly seeds: readonly number[];
  readonly mine: readonly number[];
  readonly base: readonly number[];
}

/**
 * Every learner against the baseline, paired by seed, in config order (combinations,
 * targets, noises, learners, then score severities before the per-seed measures), each
 * in its family:
 * - `identical`: the values are equal in every seed (identical features, both undefined
 *   included), or the differences are the same in every seed, or the noise moved neither
 *   learner's score in any seed
 *   (it reaches neither one's inputs), so its noisy, drop and area restate the clean
 *   comparison. No p: there is nothing to test.
 * - `primary`: the primary measure of a learner that is neither the baseline nor a
 *   control; Holm (1979) runs over this family of each combination.
 * - `exploratory`: everything else, Holm-adjusted within its combination, target and noise.
 * A comparison whose pairs repeat, seed for seed, one listed earlier (the clean score under
 * every noise after the first, every score under a noise that reaches neither learner) is
 * listed once, at its first place.
 */
export function compareWithBaseline(combos: readonly Combination[], rules: FamilyRules): Comparison[] {
  return combos.flatMap((combo) => adjusted(comboComparisons(combo, rules)));
}

function comboComparisons(combo: Combination, rules: FamilyRules): Comparison[] {
  const { baseline } = rules;
  const seen = new Set<string>();
  const out: Comparison[] = [];
  const learners = unique(combo.rows.map((r) => r.learner)).filter((l) => l !== baseline);
  for (const group of scoreGroups(combo)) {
    for (const learner of learners) {
      const still = unmoved(group.rows, [learner, baseline]);
      for (const pairing of pairings(group, learner, baseline)) {
        const key = JSON.stringify([learner, group.target, group.metric, pairing.measure, pairing.seeds, pairing.mine, pairing.base]);
        if (seen.has(key)) continue;
        seen.add(key);
        const test = pairedComparison(pairing.mine, pairing.base);
        const same = pairing.mine.every((v, i) => Object.is(v, pairing.base[i]));
        const identical = same || test.note === 'differences have zero variance' || (still && (pairing.measure !== 'score' || pairing.severity !== 0));
        const family: Family = identical ? 'identical'
          : pairing.measure === rules.primary && !rules.controls.has(learner) ? 'primary' : 'exploratory';
        out.push({
          ...test, ...(identical ? { t: NaN, p: NaN, dz: NaN } : {}), pHolm: NaN,
          combination: combo.index, vary: combo.values, learner, baseline, target: group.target, channel: group.channel, kind: group.kind,
          severity: pairing.severity, measure: pairing.measure, family, metric: group.metric,
        });
      }
    }
  }
  return out;
}

/** The learner's and the baseline's values on their common seeds: each score severity, then each per-seed measure. */
function pairings(group: ScoreGroup, learner: string, baseline: string): Pairing[] {
  const pair = (severity: number | null, measure: Measure, mineBySeed: Map<number, number>, baseBySeed: Map<number, number>): Pairing => {
    const seeds = [...mineBySeed.keys()].filter((s) => baseBySeed.has(s)).sort((a, b) => a - b);
    return { severity, measure, seeds, mine: seeds.map((s) => mineBySeed.get(s)!), base: seeds.map((s) => baseBySeed.get(s)!) };
  };
  const scores = severities(group.rows).map((severity) => {
    const at = group.rows.filter((r) => r.severity === severity);
    return pair(severity, 'score', bySeed(at, (r) => r.learner === learner), bySeed(at, (r) => r.learner === baseline));
  });
  const measures = SEED_MEASURES.map((measure) => {
    const of = group.measures.filter((r) => r.measure === measure);
    return pair(null, measure, bySeed(of, (r) => r.learner === learner), bySeed(of, (r) => r.learner === baseline));
  });
  return [...scores, ...measures].filter((p) => p.seeds.length > 0);
}

/** Whether noise left every score of these learners at its clean value, in every seed. */
function unmoved(rows: readonly ScoreRow[], learners: readonly string[]): boolean {
  const clean = new Map<string, number>();
  for (const r of rows) if (r.severity === 0) clean.set(`${r.learner}/${r.seed}`, r.value);
  const mine = rows.filter((r) => learners.includes(r.learner));
  return mine.some((r) => r.severity > 0) && mine.every((r) => Object.is(r.value, clean.get(`${r.learner}/${r.seed}`)));
}

/** Holm-adjusted p over the primary family, and over each target and noise of the exploratory family. */
function adjusted(comparisons: readonly Comparison[]): Comparison[] {
  const familyOf = (c: Comparison): string | null => (c.family === 'identical' ? null
    : c.family === 'primary' ? 'primary' : JSON.stringify([c.target, c.channel, c.kind]));
  const pHolm = comparisons.map(() => NaN);
  for (const family of unique(comparisons.map(familyOf))) {
    if (family == null) continue;
    const members = comparisons.flatMap((c, i) => (familyOf(c) === family ? [i] : []));
    holm(members.map((i) => comparisons[i].p)).forEach((p, j) => { pHolm[members[j]] = p; });
  }
  return comparisons.map((c, i) => ({ ...c, pHolm: pHolm[i] }));
}

/** Holm's m of the primary family of each combination: its comparisons with a defined p. */
export function primaryFamilySizes(comparisons: readonly Comparison[]): Map<number, number> {
  const sizes = new Map<number, number>();
  for (const c of comparisons) {
    if (c.family === 'primary' && !Number.isNaN(c.p)) sizes.set(c.combination, (sizes.get(c.combination) ?? 0) + 1);
  }
  return sizes;
}

/** Whether a comparison shows a reliable difference: Holm p < 0.05 and a CI that excludes 0. */
export function isReliable(c: Comparison): boolean {
  return c.pHolm < 0.05 && (c.ciLow > 0 || c.ciHigh < 0);
}
