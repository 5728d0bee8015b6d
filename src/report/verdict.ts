import type { SeedMeasure } from '../probe/robustness.js';
import { pairedComparison, type PairedComparison } from '../stats/paired.js';
import { isReliable, type Comparison } from './comparisons.js';
import { bySeed, type ScoreGroup } from './groups.js';
import { num, pValue, signed } from './markdown.js';
import { detectableDz } from './power-line.js';

/** How a verdict names a reliable difference in each measure, by the sign of learner − baseline. */
const WORDS: Readonly<Record<SeedMeasure, { readonly up: string; readonly down: string }>> = {
  noisy: { up: 'kept reliably more of the world under noise than', down: 'kept reliably less of the world under noise than' },
  drop: { up: 'lost reliably more to the noise than', down: 'lost reliably less to the noise than' },
  area: { up: 'kept a reliably larger share of its clean score than', down: 'kept a reliably smaller share of its clean score than' },
};

/** What the verdict of one target and noise is written from. */
export interface VerdictInput {
  readonly group: ScoreGroup;
  readonly baseline: string;
  readonly primary: SeedMeasure;
  /** The comparisons of this target and noise (every family). */
  readonly comparisons: readonly Comparison[];
  /** Learners in the primary family (neither the baseline nor a control), in config order. */
  readonly learners: readonly string[];
  /** Holm's m of the primary family of this combination. */
  readonly familySize: number;
}

/**
 * The verdict of one target and noise from the primary family, as Markdown list lines: for
 * each learner, whether it kept reliably more (or less) of the world under noise than the
 * baseline, the difference with its 95% CI beside the clean difference (both on the
 * chance-corrected scale), and what the seeds could have detected. One learner fits one
 * line; several get one nested line each, so a sweep of many learners stays readable. It
 * says "in these runs" and never takes a non-significant difference for equality.
 */
export function verdictLines(input: VerdictInput): string[] {
  const { group, baseline, primary } = input;
  const where = `${group.target} under ${group.channel} ${group.kind} noise`;
  const parts = input.learners.map((learner) => learnerVerdict(input, learner));
  if (parts.length === 0) return [`- ${where}: no learner other than the baseline and the controls, so there is no primary comparison.`];
  const head = `${where} (${primary}, learner − ${baseline}, chance-corrected)`;
  if (parts.length === 1) return [`- ${head}: in these runs, ${parts[0]}.`];
  return [`- ${head}, in these runs:`, ...parts.map((part) => `  - ${part}.`)];
}

function learnerVerdict(input: VerdictInput, learner: string): string {
  const { baseline, primary } = input;
  const c = input.comparisons.find((x) => x.learner === learner && x.measure === primary);
  if (c == null) {
    return input.group.measures.some((r) => r.learner === learner)
      ? `${learner}: the same comparison as under an earlier noise (the noise reaches neither learner)`
      : `${learner}: no ${primary} values paired with ${baseline} by seed`;
  }
  const clean = cleanDifference(input.group, learner, baseline);
  const difference = `${signed(c.meanDiff)} [${signed(c.ciLow)}, ${signed(c.ciHigh)}]`;
  const beside = `clean ${signed(clean.meanDiff)} [${signed(clean.ciLow)}, ${signed(clean.ciHigh)}]`;
  const seeds = `${c.n} seed${c.n === 1 ? '' : 's'}`;
  if (c.family === 'identical') return identicalText(input, learner, c);
  if (isReliable(c)) {
    return `${learner} ${WORDS[primary][c.meanDiff > 0 ? 'up' : 'down']} ${baseline}: ${difference}, Holm p ${pValue(c.pHolm)}, ${seeds}; ${beside}`;
  }
  return `${learner} did not differ reliably from ${baseline}: ${difference}, Holm p ${pValue(c.pHolm)}, ${seeds}; ${beside}; ${detectable(c, input.familySize)}`;
}

/** Why an identical comparison has nothing to test. */
function identicalText({ group, baseline, primary }: VerdictInput, learner: string, c: Comparison): string {
  const values = group.measures.filter((r) => r.measure === primary && (r.learner === learner || r.learner === baseline)).map((r) => r.value);
  if (values.length > 0 && values.every((v) => v === 0)) {
    return `both ${learner} and ${baseline} kept nothing of it under this noise (corrected ${primary} 0 in every seed): nothing to compare`;
  }
  return c.note === 'differences have zero variance'
    ? `${learner} − ${baseline} was ${signed(c.meanDiff)} in every seed (identical features, or noise that changes neither): nothing to test`
    : `the noise moved neither ${learner}'s nor ${baseline}'s scores in any seed (it reaches neither one's inputs): nothing to test about robustness`;
}

/** What the seeds could have detected, in d_z and in the measure's units; a miss is not evidence of equality. */
function detectable(c: Comparison, familySize: number): string {
  const dz = detectableDz(Math.max(1, familySize), c.n);
  if (!Number.isFinite(dz)) return 'too few seeds to test, which is not evidence that the two are equally robust';
  const units = Number.isFinite(c.sdDiff) ? ` (about ${num(dz * c.sdDiff)} at this spread)` : '';
  return `these seeds detect d_z ≥ ${num(dz, 2)}${units} with 80% power, so a smaller difference may have been missed: not evidence that the two are equally robust`;
}

/** learner − baseline of the corrected clean score, per seed noisy + drop, paired by seed. */
export function cleanDifference(group: ScoreGroup, learner: string, baseline: string): PairedComparison {
  const clean = (who: string): Map<number, number> => {
    const noisy = bySeed(group.measures, (r) => r.learner === who && r.measure === 'noisy');
    const drop = bySeed(group.measures, (r) => r.learner === who && r.measure === 'drop');
    return new Map([...noisy].filter(([seed]) => drop.has(seed)).map(([seed, value]) => [seed, value + drop.get(seed)!]));
  };
  const mine = clean(learner);
  const base = clean(baseline);
  const seeds = [...mine.keys()].filter((s) => base.has(s)).sort((a, b) => a - b);
  return pairedComparison(seeds.map((s) => mine.get(s)!), seeds.map((s) => base.get(s)!));
}
