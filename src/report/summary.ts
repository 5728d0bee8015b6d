import { AREA_MIN_CLEAN } from '../probe/robustness.js';
import { primaryFamilySizes, type Comparison } from './comparisons.js';
import { noises, scoreGroups, unique, type Combination, type ScoreGroup } from './groups.js';
import { cellsOf, type LearnerCka } from './learner-cka.js';
import type { StoredRun } from './load.js';
import { meanCi, table } from './markdown.js';
import { robustnessPlotPath, trainingPlotPath } from './plots.js';
import { powerLine } from './power-line.js';
import { FEW_SEEDS, alignmentTable, comparisonTable, descriptiveTable, iqmTable, measureTable, scoreTable } from './sections.js';
import { verdictLines } from './verdict.js';

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

/**
 * The text of summary.md: what was run, how to read it and what it can detect, the
 * verdict per target and noise, then per vary combination the tables behind it, failed
 * cells and warnings. Headings go down one level at a time.
 */
export function summaryMarkdown(input: SummaryInput): string {
  const { run } = input;
  const multi = run.varyKeys.length > 0;
  const lines = [`# ${run.name}`, '', ...preamble(input), ''];
  if (run.baseline != null) lines.push('## Verdict', '', ...verdictBlock(input, multi), '');
  for (const combo of input.combinations) {
    if (multi) lines.push(`## Combination ${combo.index}: ${comboText(run, combo)}`, '');
    lines.push(...combinationBlock(input, combo, multi ? combo.index : null, multi ? '###' : '##'));
  }
  const failed = run.cells.map((c) => c.record).filter((record) => record.status === 'failed');
  if (failed.length > 0) {
    lines.push('## Failed cells', '', ...table(['cell', 'learner', 'seed', ...run.varyKeys, 'reason'],
      failed.map(({ id, identity, reason }) => [id, identity.learner.name, String(identity.seed), ...run.varyKeys.map((k) => identity.vary[k] ?? ''), reason || 'no reason recorded'])), '');
  }
  if (input.warnings.length > 0) lines.push('## Warnings', '', ...input.warnings.map((w) => `- ${w}`), '');
  return lines.join('\n');
}

function comboText(run: StoredRun, combo: Combination): string {
  return run.varyKeys.map((k) => `\`${k}\` = ${combo.values[k]}`).join(', ');
}

/** Learners of the primary family: neither the baseline nor a control, in config order. */
function primaryLearners(run: StoredRun): string[] {
  return [...run.learners].filter(([name, control]) => name !== run.baseline && !control).map(([name]) => name);
}

function preamble({ run }: SummaryInput): string[] {
  const cellIds = unique([...run.rows.map((r) => r.cell), ...run.cells.map((c) => c.record.id)]);
  const failed = run.cells.filter((c) => c.record.status === 'failed').length;
  const seeds = unique(run.rows.map((r) => r.seed)).sort((a, b) => a - b);
  const controls = [...run.learners].filter(([, control]) => control).map(([name]) => `\`${name}\``);
  const lines = [
    `From ${run.rows.length + run.measures.length} result rows of ${cellIds.length} cells (${cellIds.length - failed} with results, ${failed} failed); seeds ${seeds.join(', ')}.`,
    run.baseline == null ? 'No baseline learner is set, so there are no paired comparisons.'
      : `Baseline learner: \`${run.baseline}\`. Controls (compared in the exploratory family only): ${controls.length === 0 ? 'none' : controls.join(', ')}.`,
    '',
    '## How to read this',
    '',
    'Scores are R² for continuous targets and accuracy for categorical ones, each cell the mean over seeds ± the half-width of its 95% confidence interval (Student t), with n seeds.',
    '',
    `Robustness is measured per seed on a chance-corrected scale: accuracy becomes (accuracy − chance) / (1 − chance), chance being the majority class's share of the training rows (the form of Cohen's kappa, Cohen 1960); both it and R² are floored at 0, so features that carry nothing score 0 and cannot look sturdy, and a read-out that noise pushes below chance does not count as less than nothing. \`noisy\` is the mean corrected score over the noisy severities (how much of the world the features still carry under noise; the per-seed counterpart of the corruption error of Hendrycks & Dietterich 2019), \`drop\` is the corrected clean score minus \`noisy\`, and \`area\` is the area under the corrected curve over clean score × severity range (n/a when the corrected clean score is below ${AREA_MIN_CLEAN}).`,
  ];
  if (run.baseline == null) return lines;
  lines.push('',
    `Paired differences are learner − baseline on the same seeds (same data, noise draws and initial weights), with the paired t-test and d_z. The *primary* family is \`${run.primary}\` for every learner that is neither the baseline nor a control, under every target and noise; Holm's correction (Holm 1979) runs over that family alone, per combination. Everything else (the scores at each severity, the other measures, the controls) is *exploratory*: Holm-adjusted within its target and noise only, to be read as leads rather than findings. A comparison whose differences are the same in every seed, or under a noise that moved neither learner's scores, is *identical* and has no p. A comparison that repeats one listed earlier seed for seed (the clean score under every noise after the first) is listed once. A difference counts as reliable when its Holm-adjusted p < 0.05 and its 95% CI excludes 0.`,
    '', powerParagraph(run, seeds.length));
  return lines;
}

/** The power line with the primary family as the config plans it (without the config's counts, as the measures show it). */
function powerParagraph(run: StoredRun, seeds: number): string {
  const factors = run.plannedFactors ?? {
    targets: unique(run.measures.map((r) => r.target)).length,
    noises: noises(run.measures).length,
  };
  return powerLine({ learners: primaryLearners(run).length, ...factors }, seeds);
}

/** The verdict of each target and noise (per combination), then the caution. */
function verdictBlock(input: SummaryInput, multi: boolean): string[] {
  const { run } = input;
  const baseline = run.baseline as string;
  const sizes = primaryFamilySizes(input.comparisons);
  const lines: string[] = [];
  for (const combo of input.combinations) {
    if (multi) lines.push(`Combination ${combo.index} (${comboText(run, combo)}):`, '');
    for (const group of scoreGroups(combo)) {
      const comparisons = input.comparisons.filter((c) => c.combination === combo.index && c.target === group.target
        && c.channel === group.channel && c.kind === group.kind);
      lines.push(...verdictLines({ group, baseline, primary: run.primary, comparisons, learners: primaryLearners(run), familySize: sizes.get(combo.index) ?? 0 }));
    }
    lines.push('');
  }
  const seeds = unique(run.rows.map((r) => r.seed)).length;
  lines.push(`These results come from a synthetic world with hand-written physics and small networks: they say what these learners did in these runs, not what brains do.${seeds < FEW_SEEDS ? ` With ${seeds} seeds the tests have little power; a difference that is not reliable here is not evidence that the learners are equally robust.` : ''}`);
  return lines;
}

function combinationBlock(input: SummaryInput, combo: Combination, index: number | null, heading: string): string[] {
  const lines: string[] = [];
  for (const group of scoreGroups(combo)) lines.push(...noiseSection(input, combo, index, group, heading));
  lines.push(...ckaBlocks(input, combo, heading));
  const training = trainingPlotPath(index);
  if (input.plots.has(training)) lines.push(`${heading} Training`, '', `![validation loss per epoch](${training})`, '');
  const alignment = alignmentTable(cellsOf(input.run, combo));
  if (alignment.length > 0) {
    lines.push(`${heading} Weight-update angle of the learning rule`, '',
      'Angle between each layer\'s weight update under the learning rule and the true gradient\'s, at the epoch whose weights the cell kept (lowest validation loss; 0° = backprop\'s direction, 90° = unrelated).', '',
      ...alignment, '');
  }
  return lines;
}

/** Scores, per-seed robustness, descriptive CE and paired comparisons of one target under one noise. */
function noiseSection(input: SummaryInput, combo: Combination, index: number | null, group: ScoreGroup, heading: string): string[] {
  const { baseline } = input.run;
  const { target, metric, rows } = group;
  const chance = combo.rows.filter((r) => r.target === target && r.channel === group.channel && r.kind === group.kind && r.metric === 'chance');
  const lines = [`${heading} ${target}: ${group.channel} ${group.kind} noise (${METRIC_NAMES[metric]})`, '',
    ...severityParameters(group), '', ...scoreTable(rows, chance), ''];
  if (unique(rows.map((r) => r.seed)).length >= FEW_SEEDS) {
    lines.push('Interquartile mean over seeds with its 95% percentile-bootstrap CI (Agarwal et al. 2021):', '',
      ...iqmTable(rows, `${combo.index}/${target}/${group.channel}/${group.kind}`), '');
  }
  const plot = robustnessPlotPath(target, group.channel, group.kind, index);
  if (input.plots.has(plot)) lines.push(`![${target} under ${group.channel} ${group.kind} noise](${plot})`, '');
  if (group.measures.length > 0) lines.push('Robustness per seed, chance-corrected (mean ± 95% CI over seeds):', '', ...measureTable(group.measures), '');
  if (baseline == null) return lines;
  lines.push(`Descriptive, not tested: corruption error (CE) and relative CE of the mean curves against \`${baseline}\` (Hendrycks & Dietterich 2019); defined per model, so no CI.`, '',
    ...descriptiveTable(rows, baseline), '');
  const mine = input.comparisons.filter((c) => c.combination === combo.index && c.target === target && c.channel === group.channel && c.kind === group.kind);
  if (mine.length > 0) lines.push(`Paired differences against \`${baseline}\` (learner − baseline; measures on the corrected scale):`, '', ...comparisonTable(mine), '');
  return lines;
}

/** The severity table row this noise used: the corruption parameter at each severity. */
function severityParameters(group: ScoreGroup): string[] {
  const levels = unique(group.rows.map((r) => r.severity)).sort((a, b) => a - b);
  const parameter = (s: number) => group.rows.find((r) => r.severity === s)?.parameter ?? NaN;
  const text = (p: number) => (p === Infinity ? '∞' : String(Number(p.toPrecision(4))));
  return [`Corruption parameter per severity: ${levels.map((s) => `${s} → ${text(parameter(s))}`).join(', ')}.`];
}

function ckaBlocks(input: SummaryInput, combo: Combination, heading: string): string[] {
  const lines: string[] = [];
  const cka = combo.rows.filter((r) => r.metric === 'cka');
  for (const noise of noises(cka)) {
    const rows = cka.filter((r) => r.channel === noise.channel && r.kind === noise.kind);
    lines.push(`${heading} CKA between clean and noisy features: ${noise.channel} ${noise.kind} noise`, '',
      'Linear CKA (Kornblith et al. 2019) of each learner\'s features on clean and on corrupted test inputs; 1 means the noise did not move the representation.', '',
      ...scoreTable(rows, []), '');
  }
  const between = input.learnerCka.get(combo.index);
  if (between != null) {
    lines.push(`${heading} CKA between learners on clean test features`, '',
      ...table(['learner', ...between.learners], between.learners.map((l, i) => [l, ...between.matrix[i].map(meanCi)])), '');
  }
  return lines;
}
