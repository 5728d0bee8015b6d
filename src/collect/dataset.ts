import type { ChannelName } from '../senses/channel.js';

/** Ground-truth variables recorded every step, usable as probe targets. */
export const LATENT_NAMES = [
  'x', 'y', 'heading', 'material_under', 'material_ahead', 'wall_ahead',
  'nearest_emitter', 'nearest_distance_m', 'nearest_azimuth_deg',
  'emitter_in_view', 'moved', 'bumped',
] as const;
export type LatentName = (typeof LATENT_NAMES)[number];

/**
 * Everything the agent experienced, one row per step.
 *
 * Channel arrays are flattened row-major: [steps, channelSize[c]]. Categorical latents
 * hold class indices as floats (heading 0..3 in HEADINGS order, materials and emitters
 * as indices into the world's lists, booleans 0/1).
 */
export interface Dataset {
  readonly steps: number;
  readonly channelSize: Readonly<Record<ChannelName, number>>;
  readonly channels: Readonly<Record<ChannelName, Float32Array>>;
  readonly latents: Readonly<Record<LatentName, Float32Array>>;
  /** Episode index of each step. */
  readonly episode: Int32Array;
  /** 1 where step t + 1 belongs to the same episode as step t (so t → t+1 is a real transition). */
  readonly hasNext: Uint8Array;
  /** Class names for each categorical latent, in index order. */
  readonly classNames: Readonly<Partial<Record<LatentName, readonly string[]>>>;
}

/** Step indices of each split; whole episodes go to one split. */
export interface DatasetSplit {
  readonly train: Int32Array;
  readonly validation: Int32Array;
  readonly test: Int32Array;
}

/** Whether a latent is read out by regression (continuous) or classification (categorical). */
export const LATENT_KIND: Readonly<Record<LatentName, 'continuous' | 'categorical'>> = {
  x: 'continuous',
  y: 'continuous',
  heading: 'categorical',
  material_under: 'categorical',
  material_ahead: 'categorical',
  wall_ahead: 'categorical',
  nearest_emitter: 'categorical',
  nearest_distance_m: 'continuous',
  nearest_azimuth_deg: 'continuous',
  emitter_in_view: 'categorical',
  moved: 'categorical',
  bumped: 'categorical',
};

/** What a latent's number means: a unit for continuous ones, the class index rule for categorical ones. */
export const LATENT_UNITS: Readonly<Record<LatentName, string>> = {
  x: 'cell column, 0 at the left (west) edge',
  y: 'cell row, 0 at the top (north) edge',
  heading: 'class index',
  material_under: 'class index',
  material_ahead: 'class index',
  wall_ahead: 'class index (0 no, 1 yes)',
  nearest_emitter: 'class index',
  nearest_distance_m: 'metres between cell centres',
  nearest_azimuth_deg: 'degrees, 0 straight ahead, positive to the right, −180 < azimuth ≤ 180',
  emitter_in_view: 'class index (0 no, 1 yes)',
  moved: 'class index (0 no, 1 yes)',
  bumped: 'class index (0 no, 1 yes)',
};

/**
 * The number of classes of a categorical latent: one per class name of the dataset, never
 * fewer than the largest index present + 1 (a dataset built without names), and at least 2,
 * since a latent with one possible value is still a yes/no question to a classifier.
 */
export function classCount(data: Dataset, name: LatentName): number {
  if (LATENT_KIND[name] !== 'categorical') throw new Error(`latent '${name}' is continuous; it has no classes`);
  let count = Math.max(2, data.classNames[name]?.length ?? 0);
  for (const v of data.latents[name]) if (v >= 0) count = Math.max(count, v + 1);
  return count;
}

/** The latents as one row per step, [steps, LATENT_NAMES.length] in LATENT_NAMES order. */
export function latentRows(data: Dataset): Float32Array {
  const width = LATENT_NAMES.length;
  const rows = new Float32Array(data.steps * width);
  LATENT_NAMES.forEach((name, j) => data.latents[name].forEach((value, t) => { rows[t * width + j] = value; }));
  return rows;
}
