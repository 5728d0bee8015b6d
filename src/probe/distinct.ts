import type { FeatureExtractor } from '../learn/spec.js';
import type { ChannelName } from '../senses/channel.js';

/** Rows grouped by identical values: each distinct row once, and which one every row is. */
export interface DistinctRows {
  /** Position of each distinct row's first occurrence among the given rows. */
  readonly first: Int32Array; // [distinct]
  /** For each given row, the index of its distinct row. */
  readonly index: Int32Array; // [n]
}

/**
 * Groups n rows whose values are bitwise identical in every given array ([n, width]
 * each). An agent in a grid world sees the same view again and again (a 20 000-step
 * walk in a demo world shows a few hundred distinct views), and a deterministic encoder
 * maps equal inputs to equal features, so each distinct row need be encoded, projected
 * and fitted only once, weighted by how often it occurs.
 */
export function distinctRows(arrays: readonly Float32Array[], n: number): DistinctRows {
  const words = arrays.map((values) => {
    const width = n === 0 ? 0 : values.length / n;
    if (!Number.isInteger(width)) throw new Error(`distinctRows: ${values.length} values are not ${n} rows`);
    return { bits: new Uint32Array(values.buffer, values.byteOffset, values.length), width };
  });
  const capacity = 2 ** Math.ceil(Math.log2(2 * n + 2)); // at most half full: short probe sequences
  const slots = new Int32Array(capacity).fill(-1); // distinct index, or −1 for an empty slot
  const first: number[] = [];
  const index = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let slot = rowHash(words, i) & (capacity - 1);
    while (slots[slot] >= 0 && !sameRow(words, first[slots[slot]], i)) slot = (slot + 1) & (capacity - 1);
    if (slots[slot] < 0) {
      slots[slot] = first.length;
      first.push(i);
    }
    index[i] = slots[slot];
  }
  return { first: Int32Array.from(first), index };
}

/** How many rows share each distinct row. */
export function multiplicity(index: Int32Array, distinct: number): Int32Array {
  const counts = new Int32Array(distinct);
  for (const u of index) counts[u]++;
  return counts;
}

interface RowWords {
  readonly bits: Uint32Array;
  readonly width: number;
}

/** FNV-1a over the row's 32-bit words (Fowler, Noll & Vo; the 32-bit offset basis and prime). */
function rowHash(words: readonly RowWords[], i: number): number {
  let hash = 0x811c9dc5;
  for (const { bits, width } of words) {
    for (let j = i * width; j < (i + 1) * width; j++) hash = Math.imul(hash ^ bits[j], 0x01000193);
  }
  return hash >>> 0;
}

function sameRow(words: readonly RowWords[], a: number, b: number): boolean {
  for (const { bits, width } of words) {
    for (let j = 0; j < width; j++) if (bits[a * width + j] !== bits[b * width + j]) return false;
  }
  return true;
}

/** Encoder inputs for some rows: each channel the encoder reads, [n, channelSize]. */
export interface RowInputs {
  readonly n: number;
  readonly channels: Readonly<Partial<Record<ChannelName, Float32Array>>>;
}

/** Features of one set of rows: each distinct input's features once, and the distinct input of every row. */
export interface DistinctFeatures {
  readonly features: Float32Array; // [distinct, featureSize]
  readonly distinct: number;
  readonly index: Int32Array; // [n]
}

/**
 * Features of several sets of rows from a single `encoder.features` call that sees each
 * distinct input of a set once: as few forward passes as the extractor's chunking allows.
 */
export function encodeDistinct(
  encoder: FeatureExtractor,
  channelSize: Readonly<Record<ChannelName, number>>,
  sets: readonly RowInputs[],
): DistinctFeatures[] {
  const groups = sets.map((set) => distinctRows(encoder.input.map((channel) => inputOf(set, channel)), set.n));
  const total = groups.reduce((sum, g) => sum + g.first.length, 0);
  const inputs: Partial<Record<ChannelName, Float32Array>> = {};
  for (const channel of encoder.input) {
    const width = channelSize[channel];
    const out = new Float32Array(total * width); // every set's distinct rows, set after set
    let row = 0;
    sets.forEach((set, s) => {
      const values = inputOf(set, channel);
      for (const p of groups[s].first) out.set(values.subarray(p * width, (p + 1) * width), width * row++);
    });
    inputs[channel] = out;
  }
  const features = encoder.features(inputs, total);
  const d = encoder.featureSize;
  let offset = 0;
  return groups.map(({ first, index }) => {
    const part = features.subarray(offset * d, (offset + first.length) * d);
    offset += first.length;
    return { features: part, distinct: first.length, index };
  });
}

function inputOf(set: RowInputs, channel: ChannelName): Float32Array {
  const values = set.channels[channel];
  if (values == null) throw new Error(`encodeDistinct: input channel '${channel}' is missing`);
  return values;
}
