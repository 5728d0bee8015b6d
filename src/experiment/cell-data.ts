import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { collect } from '../collect/collector.js';
import type { Dataset, DatasetSplit } from '../collect/dataset.js';
import { splitByEpisode } from '../collect/split.js';
import { parseWorld } from '../world/parse.js';
import type { World } from '../world/types.js';
import type { PlannedCell } from './plan.js';

/** What a cell learns and is probed on: its world, the experience collected there, and the split by episode. */
export interface CellData {
  readonly world: World;
  readonly data: Dataset;
  readonly split: DatasetSplit;
}

/**
 * The experience of one cell, regenerated from its seed: the world file (which must still
 * hash to what the plan saw), the collected walk and its split. The one definition of a
 * cell's data: the cell pipeline trains on it and `crosswise record` writes it.
 */
export function cellData(cell: Pick<PlannedCell, 'world' | 'collect' | 'senses' | 'seed'>): CellData {
  const worldBytes = readFileSync(cell.world.path);
  if (createHash('sha256').update(worldBytes).digest('hex') !== cell.world.sha256) {
    throw new Error(`world file ${cell.world.path} changed since the sweep was planned; plan again`);
  }
  const world = parseWorld(worldBytes.toString('utf8'), cell.world.path); // the bytes just hashed, not a second read
  const { policy, steps, episodeSteps, split: fractions } = cell.collect;
  const data = collect(world, { policy, steps, episodeSteps }, cell.senses, cell.seed);
  return { world, data, split: splitByEpisode(data, fractions, cell.seed) };
}
