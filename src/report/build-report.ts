import { mkdir, readdir, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { summarise } from '../stats/summarise.js';
import { writeFileAtomic } from '../results/atomic-file.js';
import { formatComparisonsCsv } from '../results/comparisons-table.js';
import { outputPath } from '../results/layout.js';
import { writeResultsCsv } from '../results/stored-results.js';
import { compareWithBaseline } from './comparisons.js';
import { combinations, scoreGroups, severities, unique, type Combination } from './groups.js';
import { cellsOf, learnerCka, type LearnerCka } from './learner-cka.js';
import { loadRun, type StoredCell, type StoredRun } from './load.js';
import { bandPlotSvg, robustnessPlotPath, trainingPlotPath, type BandPoint } from './plots.js';
import { learnerSummaries } from './sections.js';
import { silentLayerNotes } from './silent-layers.js';
import { summaryMarkdown } from './summary.js';

/** What `buildReport` wrote. */
export interface ReportFiles {
  readonly resultsPath: string;
  readonly summaryPath: string;
  readonly comparisonsPath: string;
  /** Paths of the SVG plots written, joined to outDir. */
  readonly plots: string[];
  readonly warnings: string[];
}

/**
 * Rebuilds results.csv, summary.md, comparisons.csv and plots/*.svg from an output
 * folder's stored cells alone, in config order, so `crosswise run` and `crosswise report`
 * write the same bytes. Every file is written atomically. Throws a one-line error when
 * the folder or its results are missing.
 */
export async function buildReport(outDir: string): Promise<ReportFiles> {
  const run = loadRun(outDir);
  const resultsPath = writeResultsCsv(outDir, run.results);
  const warnings = [...run.warnings, ...silentLayerNotes(run.cells)];
  const combos = combinations(run.rows, run.varyKeys, run.measures);
  const controls = new Set([...run.learners].filter(([, control]) => control).map(([name]) => name));
  const comparisons = run.baseline == null ? [] : compareWithBaseline(combos, { baseline: run.baseline, primary: run.primary, controls });
  const learners = unique(run.rows.map((r) => r.learner));
  await mkdir(outputPath(outDir, 'plots'), { recursive: true });
  const plots = new Set<string>();
  const ckaByCombo = new Map<number, LearnerCka | null>();
  for (const combo of combos) {
    const index = run.varyKeys.length > 0 ? combo.index : null;
    for (const [path, svg] of await comboPlots(run, combo, index, learners)) {
      writeFileAtomic(join(outDir, path), svg);
      plots.add(path);
    }
    ckaByCombo.set(combo.index, await learnerCka(run, combo, warnings));
  }
  await removeStalePlots(outDir, plots);
  const summaryPath = outputPath(outDir, 'summary');
  const comparisonsPath = outputPath(outDir, 'comparisons');
  writeFileAtomic(comparisonsPath, formatComparisonsCsv(comparisons, run.varyKeys));
  writeFileAtomic(summaryPath, summaryMarkdown({ run, combinations: combos, comparisons, learnerCka: ckaByCombo, plots, warnings }));
  return { resultsPath, summaryPath, comparisonsPath, plots: [...plots].map((p) => join(outDir, p)), warnings };
}

/** Removes plots an earlier report wrote that this one did not, so plots/ always matches summary.md. */
async function removeStalePlots(outDir: string, written: ReadonlySet<string>): Promise<void> {
  const plots = outputPath(outDir, 'plots');
  for (const name of await readdir(plots)) {
    const ours = /^(robustness_.+|training(_c\d+)?)\.svg$/.test(name);
    if (ours && !written.has(`plots/${name}`)) await rm(join(plots, name), { force: true });
  }
}

/** The robustness plots (one per target and noise) and the training plot of one combination. */
async function comboPlots(run: StoredRun, combo: Combination, index: number | null, learners: readonly string[]): Promise<[string, string][]> {
  const out: [string, string][] = [];
  for (const { target, metric, channel, kind, rows } of scoreGroups(combo)) {
    const levels = severities(rows);
    const points = unique(rows.map((r) => r.learner)).flatMap((learner) =>
      learnerSummaries(rows, learner, levels).map((s, i): BandPoint => ({ learner, x: levels[i], mean: s.mean, low: s.ciLow, high: s.ciHigh })));
    const title = `${target} under ${channel} ${kind} noise`;
    out.push([robustnessPlotPath(target, channel, kind, index),
      await bandPlotSvg(points, learners, metric === 'r2'
        ? { title, x: 'severity', y: 'R² (mean, 95% CI)', range: [-Infinity, 1] }
        : { title, x: 'severity', y: 'accuracy (mean, 95% CI)', range: [0, 1] }, run.baseline)]);
  }
  const training = trainingPoints(run, combo);
  if (training.length > 0) {
    out.push([trainingPlotPath(index), await bandPlotSvg(training, learners, { title: 'Validation loss', x: 'epoch', y: 'validation loss (mean over seeds, 95% CI)' }, null)]);
  }
  return out;
}

/** Validation loss per epoch and learner, mean and 95% CI over the seeds that reached that epoch. */
function trainingPoints(run: StoredRun, combo: Combination): BandPoint[] {
  const cells = cellsOf(run, combo).filter((c) => c.record.status === 'done' && c.log.length > 0);
  const learnerOf = (c: StoredCell) => c.record.identity.learner.name;
  return unique(cells.map(learnerOf)).flatMap((learner) => {
    const mine = cells.filter((c) => learnerOf(c) === learner);
    const epochs = Math.max(...mine.map((c) => c.log.length));
    return Array.from({ length: epochs }, (_, e): BandPoint => {
      const s = summarise(mine.map((c) => c.log[e]?.validationLoss ?? NaN));
      return { learner, x: e + 1, mean: s.mean, low: s.ciLow, high: s.ciHigh };
    });
  });
}
