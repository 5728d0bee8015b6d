import { holmFamilySize, type Comparison } from './comparisons.js';
import { noises, scoreGroups, unique, type Combination, type ScoreGroup } from './groups.js';
import { cellsOf, type LearnerCka } from './learner-cka.js';
import type { StoredRun } from './load.js';
import { meanCi, table } from './markdown.js';
import { robustnessPlotPath, trainingPlotPath } from './plots.js';
import { FEW_SEEDS, alignmentTable, comparisonTable, iqmTable, robustnessTable, scoreTable, verdict } from './sections.js';

/** Everything summary.md is written from. */
export interface SummaryInput {
  readonly run: StoredRun;
  readonly combinations: readonly Combination[];
  readonly comparisons: readonly Comparison[];
  /** Per combination index; absent or null when no features were stored. */
  readonly learnerCka: ReadonlyMap<number, LearnerCka | null>;
  /** Relative paths of the plots that were written. */
  readonly plots: ReadonlySet<string>;
  readonly warnings: readonly string[];
}

const METRIC_NAMES: Readonly<Record<string, string>> = { r2: 'R²', accuracy: 'accuracy' };

/** The text of summary.md: one block of tables per vary combination, then failed cells and warnings. */
export function summaryMarkdown(input: SummaryInput): string {
  const { run } = input;
  const multi = run.varyKeys.length > 0;
  const lines = [`# ${run.name}`, '', ...preamble(input), ''];
  for (const combo of input.combinations) {
    if (multi) lines.push(`## Combination ${combo.index}: ${run.varyKeys.map((k) => `\`${k}\` = ${combo.values[k]}`).join(', ')}`, '');
    lines.push(...combinationBlock(input, combo, multi ? combo.index : null));
  }
  const failed = run.cells.map((c) => c.record).filter((record) => record.status === 'failed');
  if (failed.length > 0) {
    lines.push('## Failed cells', '', ...table(['cell', 'learner', 'seed', ...run.varyKeys, 'reason'],
      failed.map(({ id, identity, reason }) => [id, identity.learner.name, String(identity.seed), ...run.varyKeys.map((k) => identity.vary[k] ?? ''), reason || 'no reason recorded'])), '');
  }
  if (input.warnings.length > 0) lines.push('## Warnings', '', ...input.warnings.map((w) => `- ${w}`), '');
  return lines.join('\n');
}

function preamble({ run, comparisons }: SummaryInput): string[] {
  const cellIds = unique([...run.rows.map((r) => r.cell), ...run.cells.map((c) => c.record.id)]);
  const failed = run.cells.filter((c) => c.record.status === 'failed').length;
  const seeds = unique(run.rows.map((r) => r.seed)).sort((a, b) => a - b);
  const lines = [
    `From ${run.rows.length} result rows of ${cellIds.length} cells (${cellIds.length - failed} with results, ${failed} failed); seeds ${seeds.join(', ')}.`,
    run.baseline == null ? 'No baseline learner is set, so there are no paired comparisons.' : `Baseline learner: \`${run.baseline}\`.`,
    '',
    'Scores are R² for continuous targets and accuracy for categorical ones. Each cell shows the mean over seeds ± the half-width of its 95% confidence interval (Student t), with n seeds.',
  ];
  if (run.baseline != null) {
    lines.push(`Paired differences are learner − baseline on the same seeds (same data and noise draws), tested with the paired t-test; p-values are Holm-adjusted (Holm 1979) over the ${holmFamilySize(comparisons)} comparisons in this report that have a defined p-value (a clean comparison repeated under several noises counts once). p and d_z are n/a with fewer than 2 seeds or when every seed gives the same difference.`);
  }
  return lines;
}

function combinationBlock(input: SummaryInput, combo: Combination, index: number | null): string[] {
  const lines: string[] = [];
  for (const group of scoreGroups(combo.rows)) lines.push(...noiseSection(input, combo, index, group));
  lines.push(...ckaBlocks(input, combo));
  const training = trainingPlotPath(index);
  if (input.plots.has(training)) lines.push('### Training', '', `![validation loss per epoch](${training})`, '');
  const alignment = alignmentTable(cellsOf(input.run, combo));
  if (alignment.length > 0) {
    lines.push('### Alignment of the learning rule with the gradient', '',
      'Angle between each layer\'s update under the learning rule and the true gradient at the last epoch (0° = backprop\'s direction, 90° = unrelated).', '',
      ...alignment, '');
  }
  return lines;
}

/** Scores, robustness figures and paired comparisons of one target under one noise. */
function noiseSection(input: SummaryInput, combo: Combination, index: number | null, group: ScoreGroup): string[] {
  const { baseline } = input.run;
  const { target, metric, rows } = group;
  const chance = combo.rows.filter((r) => r.target === target && r.channel === group.channel && r.kind === group.kind && r.metric === 'chance');
  const lines = [`### ${target}: ${group.channel} ${group.kind} noise (${METRIC_NAMES[metric]})`, '',
    ...scoreTable(rows, chance), ''];
  if (unique(rows.map((r) => r.seed)).length >= FEW_SEEDS) {
    lines.push('Interquartile mean over seeds with its 95% percentile-bootstrap CI (Agarwal et al. 2021):', '',
      ...iqmTable(rows, `${combo.index}/${target}/${group.channel}/${group.kind}`), '');
  }
  const plot = robustnessPlotPath(target, group.channel, group.kind, index);
  if (input.plots.has(plot)) lines.push(`![${target} under ${group.channel} ${group.kind} noise](${plot})`, '');
  lines.push('Robustness of the mean curves: normalised area is the area under the curve over clean score × severity range (1 = noise costs nothing); '
    + 'drop is the clean score minus the mean score over noisy severities; CE is the summed error 1 − score over noisy severities relative to the baseline\'s, '
    + 'and relative CE counts only the error noise adds to each learner\'s own clean error (Hendrycks & Dietterich 2019).', '',
    ...robustnessTable(rows, baseline), '');
  if (baseline == null) return lines;
  const mine = input.comparisons.filter((c) => c.combination === combo.index && c.target === target
    && c.channel === group.channel && c.kind === group.kind);
  lines.push(`Paired differences against \`${baseline}\` (learner − baseline):`, '', ...comparisonTable(mine), '',
    verdict(target, group, baseline, mine), '');
  return lines;
}

function ckaBlocks(input: SummaryInput, combo: Combination): string[] {
  const lines: string[] = [];
  const cka = combo.rows.filter((r) => r.metric === 'cka');
  for (const noise of noises(cka)) {
    const rows = cka.filter((r) => r.channel === noise.channel && r.kind === noise.kind);
    lines.push(`### CKA between clean and noisy features: ${noise.channel} ${noise.kind} noise`, '',
      'Linear CKA (Kornblith et al. 2019) of each learner\'s features on clean and on corrupted test inputs; 1 means the noise did not move the representation.', '',
      ...scoreTable(rows, []), '');
  }
  const between = input.learnerCka.get(combo.index);
  if (between != null) {
    lines.push('### CKA between learners on clean test features', '',
      ...table(['learner', ...between.learners], between.learners.map((l, i) => [l, ...between.matrix[i].map(meanCi)])), '');
  }
  return lines;
}
