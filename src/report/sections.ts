import { createRng } from '../random.js';
import { bootstrapCi, interquartileMean } from '../stats/robust.js';
import { summarise, type Summary } from '../stats/summarise.js';
import type { Comparison } from './comparisons.js';
import { bySeed, severities, unique } from './groups.js';
import { meanCi, num, pValue, signed, table } from './markdown.js';
import type { StoredCell } from './load.js';
import type { MeasureRow, ScoreRow } from '../results/results-table.js';
import { AREA_MIN_CLEAN, SEED_MEASURES, corruptionError, relativeCorruptionError, type CurvePoint, type Figure } from '../probe/robustness.js';

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

/**
 * The per-seed robustness measures of each learner, mean ± CI over seeds, then one line
 * saying in how many seeds the area was undefined and why.
 */
export function measureTable(measures: readonly MeasureRow[]): string[] {
  const learners = unique(measures.map((r) => r.learner));
  const lines = table(['learner', ...SEED_MEASURES], learners.map((learner) => [learner, ...SEED_MEASURES.map((measure) =>
    meanCi(summarise(measures.filter((r) => r.learner === learner && r.measure === measure).map((r) => r.value))))]));
  const missing = learners.flatMap((learner) => {
    const areas = measures.filter((r) => r.learner === learner && r.measure === 'area');
    const undefinedAreas = areas.filter((r) => !Number.isFinite(r.value)).length;
    return undefinedAreas === 0 ? [] : [`${learner} in ${undefinedAreas} of ${areas.length} seeds`];
  });
  if (missing.length > 0) lines.push('', `area n/a (a corrected clean score below ${AREA_MIN_CLEAN} leaves nothing to keep a share of): ${missing.join('; ')}.`);
  return lines;
}

/** What a comparison compares: a score severity or a per-seed measure. */
export function comparedText(c: Pick<Comparison, 'measure' | 'severity'>): string {
  return c.measure === 'score' ? `score at severity ${c.severity}` : c.measure;
}

/** The paired comparisons of one target and noise against the baseline, with each one's family. */
export function comparisonTable(comparisons: readonly Comparison[]): string[] {
  return table(['learner', 'compared', 'family', 'difference', '95% CI', 'p (Holm)', 'd_z', 'n'], comparisons.map((c) => [
    c.learner, comparedText(c), c.family, signed(c.meanDiff), `[${signed(c.ciLow)}, ${signed(c.ciHigh)}]`,
    c.family === 'identical' ? 'none' : pValue(c.pHolm), num(c.dz, 2), String(c.n),
  ]));
}

/**
 * Corruption error and relative corruption error (Hendrycks & Dietterich 2019) of each
 * learner's mean curve of raw scores against the baseline's: descriptive figures, defined
 * per model, so they carry no CI and no test. One line names why any figure is n/a.
 */
export function descriptiveTable(rows: readonly ScoreRow[], baseline: string): string[] {
  const levels = severities(rows);
  const curve = (learner: string): CurvePoint[] =>
    learnerSummaries(rows, learner, levels).map((s, i) => ({ severity: levels[i], score: s.mean }));
  const base = curve(baseline);
  const reasons: string[] = [];
  const cell = (learner: string, name: string, figure: () => Figure): string => {
    const f = guarded(figure);
    if (f.reason != null) reasons.push(`${learner} ${name}: ${f.reason}`);
    return num(f.value);
  };
  const body = unique(rows.map((r) => r.learner)).map((l) => {
    const mine = curve(l);
    return [l, cell(l, 'CE', () => corruptionError(mine, base)), cell(l, 'relative CE', () => relativeCorruptionError(mine, base))];
  });
  const lines = table(['learner', 'CE', 'relative CE'], body);
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

/**
 * The weight-update angle of each layer at the epoch whose weights the cell kept (the
 * lowest validation loss, where early stopping restored the encoder), per learner over
 * seeds, with the epochs it comes from.
 */
export function alignmentTable(cells: readonly StoredCell[]): string[] {
  const measured = cells.flatMap((c) => {
    const best = keptEpoch(c);
    return c.record.status === 'done' && best != null && best.alignmentDeg.length > 0 ? [{ cell: c, best }] : [];
  });
  const layers = Math.max(0, ...measured.map((m) => m.best.alignmentDeg.length));
  if (layers === 0) return [];
  const learnerOf = (c: StoredCell) => c.record.identity.learner.name;
  return table(['learner', 'epoch kept (per seed)', ...Array.from({ length: layers }, (_, i) => `layer ${i + 1} (degrees)`)],
    unique(measured.map((m) => learnerOf(m.cell))).map((learner) => {
      const mine = measured.filter((m) => learnerOf(m.cell) === learner);
      return [learner, mine.map((m) => m.best.epoch).join(', '),
        ...Array.from({ length: layers }, (_, layer) => meanCi(summarise(mine.map((m) => m.best.alignmentDeg[layer] ?? NaN))))];
    }));
}

/** The log entry of the epoch the trainer kept: the first with the lowest validation loss. */
function keptEpoch(cell: StoredCell): StoredCell['log'][number] | undefined {
  let best: StoredCell['log'][number] | undefined;
  for (const entry of cell.log) if (best == null || entry.validationLoss < best.validationLoss) best = entry;
  return best;
}
