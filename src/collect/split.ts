import { createRng, permutation } from '../random.js';
import type { Dataset, DatasetSplit } from './dataset.js';

/** Fractions of episodes for each split; they must add up to 1. */
export interface SplitFractions {
  readonly train: number;
  readonly validation: number;
  readonly test: number;
}

function checkFractions({ train, validation, test }: SplitFractions): void {
  const parts = [train, validation, test];
  if (parts.some((f) => !(f >= 0 && f <= 1)) || Math.abs(train + validation + test - 1) > 1e-6) {
    throw new Error(`split fractions must be in 0..1 and add up to 1, got train ${train}, validation ${validation}, test ${test}`);
  }
}

/**
 * Splits a dataset into train, validation and test by whole episodes, so no episode's
 * steps are in two splits. Episodes are shuffled by `permutation` with createRng(seed,
 * 'split'); round(train·E) episodes go to train, round(validation·E) to validation (at
 * most what is left) and the rest to test. Step indices are ascending.
 */
export function splitByEpisode(dataset: Dataset, fractions: SplitFractions, seed: number): DatasetSplit {
  checkFractions(fractions);
  const episodes = dataset.steps === 0 ? 0 : dataset.episode[dataset.steps - 1] + 1;
  const order = permutation(episodes, createRng(seed, 'split'));
  const nTrain = Math.round(fractions.train * episodes);
  const nValidation = Math.min(Math.round(fractions.validation * episodes), episodes - nTrain);
  const part = new Uint8Array(episodes); // 0 train, 1 validation, 2 test
  order.forEach((e, rank) => { part[e] = rank < nTrain ? 0 : rank < nTrain + nValidation ? 1 : 2; });
  const buckets: number[][] = [[], [], []];
  for (let t = 0; t < dataset.steps; t++) buckets[part[dataset.episode[t]]].push(t);
  return { train: Int32Array.from(buckets[0]), validation: Int32Array.from(buckets[1]), test: Int32Array.from(buckets[2]) };
}
