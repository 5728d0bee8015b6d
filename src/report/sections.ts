import { createRng } from '../random.js';
import { bootstrapCi, interquartileMean } from '../stats/robust.js';
import { summarise, type Summary } from '../stats/summarise.js';
import { isReliable, type Comparison } from './comparisons.js';
import { bySeed, severities, unique, type Noise } from './groups.js';
import { englishList, meanCi, num, pValue, signed, table } from './markdown.js';
import type { StoredCell } from './load.js';
import type { ScoreRow } from '../results/results-table.js';
import { corruptionError, normalisedArea, relativeCorruptionError, seedRobustness, type CurvePoint, type Figure } from '../probe/robustness.js';

/** Below this many seeds the summary warns that the paired tests have little power (common practice). */
export const FEW_SEEDS = 10;

/** Mean ± CI of one learner's metric at each severity. */
export function learnerSummaries(rows: readonly ScoreRow[], learner: string, levels: readonly number[]): Summary[] {
  return levels.map((s) => summarise([...bySeed(rows, (r) => r.learner === learner && r.severity === s).values()]));
}

/** The learner × severity table of a metric, with an optional chance row. */
export function scoreTable(rows: readonly ScoreRow[], chance: readonly ScoreRow[]): string[] {
  const levels = severities(rows);
  const body = unique(rows.map((r) => r.learner)).map((l) => [l, ...learnerSummaries(rows, l, levels).map(meanCi)]);
  if (chance.length > 0) {
    body.push(['chance (majority class)', ...levels.map((s) => num(summarise(chance.filter((r) => r.severity === s).map((r) => r.value)).mean))]);
  }
  return table(['learner', ...levels.map((s) => `severity ${s}`)], body);
}

/** The paired comparisons of one target and noise against the baseline. */
export function comparisonTable(comparisons: readonly Comparison[]): string[] {
  return table(['learner', 'severity', 'difference', '95% CI', 'p (Holm)', 'd_z', 'n'], comparisons.map((c) => [
    c.learner, String(c.severity), signed(c.meanDiff), `[${signed(c.ciLow)}, ${signed(c.ciHigh)}]`,
    pValue(c.pHolm), num(c.dz, 2), String(c.n),
  ]));
}

/**
 * Normalised area, drop from clean, CE and relative CE of each learner's mean curve
 * (definitions in src/probe/robustness.ts), then one line naming why any figure is n/a.
 */
export function robustnessTable(rows: readonly ScoreRow[], baseline: string | null): string[] {
  const levels = severities(rows);
  const curve = (learner: string): CurvePoint[] =>
    learnerSummaries(rows, learner, levels).map((s, i) => ({ severity: levels[i], score: s.mean }));
  const base = baseline != null && rows.some((r) => r.learner === baseline) ? curve(baseline) : null;
  const reasons: string[] = [];
  const cell = (learner: string, name: string, figure: () => Figure): string => {
    const f = guarded(figure);
    if (f.reason != null) reasons.push(`${learner} ${name}: ${f.reason}`);
    return num(f.value);
  };
  const body = unique(rows.map((r) => r.learner)).map((l) => {
    const mine = curve(l);
    return [l, cell(l, 'normalised area', () => normalisedArea(mine)), cell(l, 'drop', () => seedRobustness(mine).drop),
      base == null ? 'n/a' : cell(l, 'CE', () => corruptionError(mine, base)),
      base == null ? 'n/a' : cell(l, 'relative CE', () => relativeCorruptionError(mine, base))];
  });
  const lines = table(['learner', 'normalised area', 'drop from clean', 'CE', 'relative CE'], body);
  if (reasons.length > 0) lines.push('', `n/a: ${reasons.join('; ')}.`);
  return lines;
}

/** A figure, or an undefined one carrying the error message when its inputs do not fit together. */
function guarded(figure: () => Figure): Figure {
  try {
    return figure();
  } catch (error) {
    return { value: NaN, reason: (error as Error).message };
  }
}

/** One plain-English sentence on which learners differ reliably from the baseline under this noise. */
export function verdict(target: string, noise: Noise, baseline: string, comparisons: readonly Comparison[]): string {
  if (comparisons.length === 0) return `In these runs, no learner could be paired with ${baseline} by seed for ${target} under ${noise.channel} ${noise.kind} noise.`;
  const noisy = comparisons.some((c) => c.severity > 0) ? comparisons.filter((c) => c.severity > 0) : comparisons;
  const seeds = Math.max(0, ...noisy.map((c) => c.n));
  const parts: string[] = [];
  const quiet: string[] = [];
  for (const learner of unique(noisy.map((c) => c.learner))) {
    const mine = noisy.filter((c) => c.learner === learner && isReliable(c));
    const higher = mine.filter((c) => c.meanDiff > 0).map((c) => String(c.severity));
    const lower = mine.filter((c) => c.meanDiff < 0).map((c) => String(c.severity));
    const at = (levels: readonly string[]): string => `${levels.length === 1 ? 'severity' : 'severities'} ${englishList(levels)}`;
    if (higher.length > 0) parts.push(`${learner} scored reliably higher than ${baseline} at ${at(higher)}`);
    if (lower.length > 0) parts.push(`${learner} scored reliably lower than ${baseline} at ${at(lower)}`);
    if (higher.length === 0 && lower.length === 0) quiet.push(learner);
  }
  if (quiet.length > 0) parts.push(`${englishList(quiet)} ${quiet.length === 1 ? 'was' : 'were'} not distinguishable from ${baseline}`);
  const noun = seeds === 1 ? 'seed' : 'seeds';
  let line = `In these runs (${seeds} ${noun}), for ${target} under ${noise.channel} ${noise.kind} noise, counting a difference as reliable when its Holm-adjusted p < 0.05 and its 95% CI excludes 0: ${parts.join('; ')}.`;
  if (seeds < FEW_SEEDS) line += ` With ${seeds} ${noun} the paired tests have little power, so "not distinguishable" is not evidence of equal robustness.`;
  return line;
}

/**
 * Interquartile mean with a 95% percentile-bootstrap CI per learner and severity
 * (Agarwal et al. 2021, NeurIPS), for runs with many seeds. The bootstrap stream is
 * seeded from a fixed name, so the same results give the same table.
 */
export function iqmTable(rows: readonly ScoreRow[], streamName: string): string[] {
  const levels = severities(rows);
  return table(['learner', ...levels.map((s) => `severity ${s}`)], unique(rows.map((r) => r.learner)).map((learner) => [
    learner, ...levels.map((s) => {
      const values = [...bySeed(rows, (r) => r.learner === learner && r.severity === s).values()];
      const ci = bootstrapCi(values, interquartileMean, createRng(0, 'bootstrap', streamName, learner, s), 2000);
      return `${num(ci.estimate)} [${num(ci.low)}, ${num(ci.high)}]`;
    }),
  ]));
}

/** Final-epoch angle between each rule's update and the true gradient, per learner and layer, over seeds. */
export function alignmentTable(cells: readonly StoredCell[]): string[] {
  const measured = cells.filter((c) => c.record.status === 'done' && (c.log.at(-1)?.alignmentDeg.length ?? 0) > 0);
  const layers = Math.max(0, ...measured.map((c) => c.log.at(-1)?.alignmentDeg.length ?? 0));
  if (layers === 0) return [];
  const learnerOf = (c: StoredCell) => c.record.identity.learner.name;
  const finalAngle = (c: StoredCell, layer: number) => c.log.at(-1)?.alignmentDeg[layer] ?? NaN;
  return table(['learner', ...Array.from({ length: layers }, (_, i) => `layer ${i + 1} (degrees)`)], unique(measured.map(learnerOf)).map((learner) => [
    learner, ...Array.from({ length: layers }, (_, layer) => meanCi(summarise(measured.filter((c) => learnerOf(c) === learner).map((c) => finalAngle(c, layer))))),
  ]));
}
