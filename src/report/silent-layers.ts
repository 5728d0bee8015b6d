import type { EpochLog } from '../learn/spec.js';
import type { StoredCell } from './load.js';

/** The epoch whose weights a cell kept: the first with the lowest validation loss (the trainer's early-stopping rule). */
function keptEpoch(log: readonly EpochLog[]): EpochLog | undefined {
  return log.reduce<EpochLog | undefined>((best, entry) => (best == null || entry.validationLoss < best.validationLoss ? entry : best), undefined);
}

/**
 * One note per learner (and vary combination) whose spiking encoder's last hidden layer
 * never spiked on the validation split at the epoch it kept, naming the seeds: its features
 * are all zero, so its probes can only score at chance.
 */
export function silentLayerNotes(cells: readonly StoredCell[]): string[] {
  const seeds = new Map<string, number[]>();
  for (const { record, log } of cells) {
    const silent = keptEpoch(log)?.firing?.silentFraction.at(-1);
    if (silent !== 1) continue;
    const { learner, seed, vary } = record.identity;
    const values = Object.entries(vary).map(([key, value]) => `${key} = ${value}`);
    const label = `learner '${learner.name}'${values.length > 0 ? ` (${values.join(', ')})` : ''}`;
    seeds.set(label, [...(seeds.get(label) ?? []), seed]);
  }
  return [...seeds].map(([label, list]) =>
    `${label}: the last hidden layer of its spiking encoder never spiked on the validation split (seed${list.length === 1 ? '' : 's'} ${list.join(', ')}); its features are all zero, so its probes score at chance`);
}
