// A test double for the runner's contract: a cell whose scores follow from its settings
// alone (so any schedule must store the same numbers), that takes a little time per
// epoch, and that fails like a diverging learner when its name says so, or kills its
// worker thread as a heap exhaustion would when FAKE_DYING names its learner. Its per-seed
// noisy, drop and area rows come from its scores through the product's own definition
// (probe/robustness.ts, with chance 0), so reports built on it have a primary family.
import { createHash } from 'node:crypto';
import type { CellWork } from '../../src/experiment/cell-work.js';
import { noiseParameter } from '../../src/noise/severity.js';
import { SEED_MEASURES, seedRobustness } from '../../src/probe/robustness.js';
import type { Measurement } from '../../src/results/results-table.js';

const EPOCH_MS = Number(process.env.FAKE_EPOCH_MS ?? '20');

/** A number in [0, 1) determined by the text. */
function unit(text: string): number {
  return createHash('sha256').update(text).digest().readUInt32BE(0) / 2 ** 32;
}

export const cellWork: CellWork = async (cell, onEpoch) => {
  const log = [];
  for (let epoch = 1; epoch <= cell.learner.train.epochs; epoch++) {
    await new Promise((resolve) => setTimeout(resolve, EPOCH_MS));
    if (cell.learner.name === process.env.FAKE_DYING) process.exit(134); // the code of a fatal out-of-memory abort (SIGABRT)
    if (cell.learner.name.includes('diverge')) {
      const error = new Error(`loss became NaN at epoch ${epoch}`);
      error.name = 'LearnerDivergedError';
      throw error;
    }
    const entry = { epoch, trainLoss: 1 / epoch, validationLoss: 1.1 / epoch, seconds: EPOCH_MS / 1000, alignmentDeg: [] };
    log.push(entry);
    onEpoch(entry);
  }
  const score = (target: string, channel: string, kind: string, severity: number): number => unit(`${cell.id}/${target}/${channel}/${kind}/${severity}`);
  const rows: Measurement[] = cell.probe.targets.flatMap((target) =>
    cell.noise.flatMap((noise) => noise.severities.map((severity, i): Measurement => ({
      target,
      channel: noise.channel,
      kind: noise.kind,
      severity,
      parameter: noiseParameter(noise, i),
      measure: 'score',
      metric: 'accuracy',
      value: score(target, noise.channel, noise.kind, severity),
    }))));
  for (const target of cell.probe.targets) {
    for (const noise of cell.noise) {
      if (!noise.severities.some((severity) => severity > 0)) continue;
      const curve = [0, ...noise.severities.filter((severity) => severity > 0)].map((severity) => ({ severity, score: score(target, noise.channel, noise.kind, severity) }));
      const figures = seedRobustness(curve);
      for (const measure of SEED_MEASURES) {
        rows.push({ target, channel: noise.channel, kind: noise.kind, severity: null, parameter: null, measure, metric: 'accuracy', value: figures[measure].value });
      }
    }
  }
  return { rows, log, seconds: { collect: 0, train: 0, probe: 0 }, versions: { fake: '1' }, arrays: {} };
};
