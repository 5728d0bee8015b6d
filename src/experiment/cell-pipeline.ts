import { LATENT_NAMES, latentRows, type Dataset } from '../collect/dataset.js';
import { initBackend, softwareVersions, trainLearner, type FeatureExtractor } from '../learn/index.js';
import { evaluateEncoder } from '../probe/evaluate.js';
import type { NpyArray } from '../results/npy.js';
import type { Measurement } from '../results/results-table.js';
import { cellData } from './cell-data.js';
import type { CellOutcome, CellWork } from './cell-work.js';

/**
 * The production cell: collect the seed's experience, split it by episode, train the
 * learner, then probe its frozen features under every noise setting. Every random draw
 * derives from the cell seed, so all learners of a seed see the same data and noise.
 */
export const cellWork: CellWork = async (cell, onEpoch) => {
  const clock = stopwatch();
  const { data, split } = cellData(cell);
  const collectSeconds = clock();
  await initBackend(cell.backend);
  const { encoder, log } = await trainLearner(cell.learner, data, split, { seed: cell.seed, onEpoch, alignEvery: cell.output.alignEvery });
  const trainSeconds = clock();
  try {
    const evaluation = evaluateEncoder({ encoder, data, split, targets: cell.probe.targets, noise: cell.noise, seed: cell.seed });
    const rows: Measurement[] = [
      ...evaluation.rows.map((row) => ({ ...row, measure: 'score' as const })),
      ...evaluation.measures.map((row) => ({ ...row, severity: null, parameter: null })),
    ];
    const arrays: Record<string, NpyArray> = {
      test_features: { shape: [evaluation.testFeatureRows, evaluation.featureSize], data: evaluation.testFeatures },
      ...(cell.output.saveFeatures ? everyStep(encoder, data) : {}),
    };
    const outcome: CellOutcome = {
      rows,
      log,
      seconds: { collect: collectSeconds, train: trainSeconds, probe: clock() },
      versions: { tfjs: softwareVersions()['tfjs-core'] },
      arrays,
    };
    return outcome;
  } finally {
    encoder.dispose();
  }
};

/** Features of every collected step [steps, featureSize] and the latents [steps, LATENT_NAMES.length] in LATENT_NAMES order. */
function everyStep(encoder: FeatureExtractor, data: Dataset): Record<string, NpyArray> {
  const inputs = Object.fromEntries(encoder.input.map((channel) => [channel, data.channels[channel]]));
  return {
    features: { shape: [data.steps, encoder.featureSize], data: encoder.features(inputs, data.steps) },
    latents: { shape: [data.steps, LATENT_NAMES.length], data: latentRows(data) },
  };
}

/** Seconds since the previous call (or since creation). */
function stopwatch(): () => number {
  let last = performance.now();
  return () => {
    const now = performance.now();
    const seconds = (now - last) / 1000;
    last = now;
    return seconds;
  };
}
