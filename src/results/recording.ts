import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { z } from 'zod';
import { LATENT_KIND, LATENT_NAMES, LATENT_UNITS, type LatentName } from '../collect/dataset.js';
import { POLICY_NAMES } from '../collect/policies.js';
import { NOISE_KINDS } from '../noise/spec.js';
import { CHANNELS, type ChannelName, type SenseSettings } from '../senses/channel.js';
import { bandCentresHz } from '../senses/mel.js';
import { CHANNEL_UNITS, channelEntryNames, channelShape } from '../senses/registry.js';
import { ACTIONS } from '../world/types.js';
import { checkedJson, parseJsonText } from './json-text.js';
import { decodeNpy, encodeNpy, type NpyData, type NpyDescr } from './npy.js';

/**
 * The version of a recording folder's layout (manifest.json and the arrays it lists).
 * Raise it whenever a reader could no longer read what an older writer wrote.
 */
export const RECORDING_FORMAT_VERSION = 1;

/** The manifest's file name; every other file of a recording is an array it lists. */
export const MANIFEST_FILE = 'manifest.json';

/** The split each step belongs to, by the number split.npy stores. */
export const SPLIT_NAMES = ['train', 'validation', 'test'] as const;

/** Arrays of a recording beside the four channels: ground truth, actions, episodes and the split. */
const OTHER_ARRAYS = ['latents', 'actions', 'episodes', 'split'] as const;
type ArrayName = ChannelName | (typeof OTHER_ARRAYS)[number];

/** The file that holds an array: `<name>.npy`. */
export const arrayFile = (name: ArrayName): string => `${name}.npy`;

const fileEntry = z.object({
  shape: z.array(z.number().int().min(0)),
  dtype: z.enum(['<f4', '<i4', '|u1']),
  units: z.string(),
  /** What each axis indexes, outermost first. */
  axes: z.array(z.string()),
  /** The name of each entry of the last axis (touch, motor). */
  entries: z.array(z.string()).optional(),
  /** Centre frequency of each band (sound). */
  bands_hz: z.array(z.number()).optional(),
  /** The name stored as each number (actions, split). */
  values: z.array(z.string()).optional(),
  /** One entry per column (latents). */
  columns: z.array(z.object({
    name: z.enum(LATENT_NAMES),
    kind: z.enum(['continuous', 'categorical']),
    units: z.string(),
    classes: z.array(z.string()).optional(),
  })).optional(),
});

const fraction = z.number().min(0).max(1);

/**
 * manifest.json: every file of a recording with its shape, dtype and units, and everything
 * the experience came from (world file and its hash, sense settings, policy, seed, split,
 * noise), in snake_case like the config.
 */
export const manifestSchema = z.object({
  format: z.literal('crosswise recording'),
  format_version: z.literal(RECORDING_FORMAT_VERSION),
  crosswise_version: z.string(),
  /** A world's walk, or exactly the data one cell of a sweep collects. */
  source: z.discriminatedUnion('kind', [
    z.object({ kind: z.literal('world') }),
    z.object({ kind: z.literal('cell'), config: z.string(), index: z.number().int().min(0), cell: z.string(), learner: z.string() }),
  ]),
  world: z.object({ name: z.string(), file: z.string(), sha256: z.string().regex(/^[0-9a-f]{64}$/) }),
  seed: z.number().int(),
  steps: z.number().int().min(1),
  collect: z.object({
    policy: z.enum(POLICY_NAMES),
    episode_steps: z.number().int().min(1),
    split: z.object({ train: fraction, validation: fraction, test: fraction }),
  }),
  senses: z.object({
    sight: z.object({ width: z.number().int().min(1), depth: z.number().int().min(1) }),
    sound: z.object({ bands: z.number().int().min(1), min_hz: z.number().positive(), max_hz: z.number().positive() }),
  }),
  /** Corruptions applied to the test steps of a channel, as the probes apply them. */
  noise: z.array(z.object({
    channel: z.enum(CHANNELS),
    kind: z.enum(NOISE_KINDS),
    severity: z.number().int().min(1),
    parameter: z.number(),
    /** The seed's sub-stream the draws come from. */
    stream: z.string(),
    rows: z.literal('test'),
  })),
  files: z.record(z.string(), fileEntry),
});

/** The one description of a recording's manifest.json, for its writer and its readers. */
export type RecordingManifest = z.infer<typeof manifestSchema>;

/** A recording in memory: the manifest and every array, flattened row-major. */
export interface Recording {
  readonly manifest: RecordingManifest;
  /** Each channel [steps, channelSize] in its physical units (test steps corrupted when the manifest lists noise). */
  readonly channels: Readonly<Record<ChannelName, Float32Array>>;
  /** [steps, LATENT_NAMES.length], LATENT_NAMES order, categorical values as class indices. */
  readonly latents: Float32Array;
  /** Index into ACTIONS of the action taken at each step. */
  readonly actions: Uint8Array;
  /** Episode number of each step, from 0. */
  readonly episodes: Int32Array;
  /** Index into SPLIT_NAMES of each step. */
  readonly split: Uint8Array;
}

/** The sense settings a manifest records, as the senses take them. */
export function manifestSenses(manifest: RecordingManifest): SenseSettings {
  const { sight, sound } = manifest.senses;
  return { sight: { ...sight }, sound: { bands: sound.bands, minHz: sound.min_hz, maxHz: sound.max_hz } };
}

/** The manifest's `senses` block for sense settings. */
export function sensesBlock(settings: SenseSettings): RecordingManifest['senses'] {
  const { sight, sound } = settings;
  return { sight: { ...sight }, sound: { bands: sound.bands, min_hz: sound.minHz, max_hz: sound.maxHz } };
}

/** The file entries of a recording of `steps` steps with the given sense settings. */
export function fileEntries(
  steps: number, settings: SenseSettings, classNames: Readonly<Partial<Record<LatentName, readonly string[]>>>,
): RecordingManifest['files'] {
  const channel = (c: ChannelName, axes: string[], extra: object) => [arrayFile(c), {
    shape: [steps, ...channelShape(c, settings)], dtype: '<f4' as const, units: CHANNEL_UNITS[c], axes: ['step', ...axes], ...extra,
  }] as const;
  const columns = LATENT_NAMES.map((name) => ({
    name, kind: LATENT_KIND[name], units: LATENT_UNITS[name],
    ...(LATENT_KIND[name] === 'categorical' ? { classes: [...(classNames[name] ?? [])] } : {}),
  }));
  return Object.fromEntries([
    channel('sight', ['depth, 0 nearest', 'width, 0 leftmost', 'colour r g b'], {}),
    channel('sound', ['ear, 0 left 1 right', 'band'], { bands_hz: [...bandCentresHz(settings)].map((hz) => Number(hz.toFixed(1))) }),
    channel('touch', ['entry'], { entries: [...channelEntryNames('touch', settings)] }),
    channel('motor', ['action'], { entries: [...channelEntryNames('motor', settings)] }),
    [arrayFile('latents'), { shape: [steps, LATENT_NAMES.length], dtype: '<f4' as const, units: 'per column', axes: ['step', 'latent'], columns }],
    [arrayFile('actions'), { shape: [steps], dtype: '|u1' as const, units: 'index into values', axes: ['step'], values: [...ACTIONS] }],
    [arrayFile('episodes'), { shape: [steps], dtype: '<i4' as const, units: 'episode number from 0', axes: ['step'] }],
    [arrayFile('split'), { shape: [steps], dtype: '|u1' as const, units: 'index into values', axes: ['step'], values: [...SPLIT_NAMES] }],
  ]);
}

/** manifest.json text: two-space indented JSON, each list of plain values on one line, ending in a line break. */
export function formatManifest(manifest: RecordingManifest): string {
  const text = JSON.stringify(manifest, null, 2).replace(/\[\s+([^[\]{}]*?)\s+\]/g, (_, inner: string) => `[${inner.split(/,\n\s*/).join(', ')}]`);
  return `${text}\n`;
}

/** Every file of a recording folder by name: manifest.json and one .npy per array. */
export function recordingFiles(recording: Recording): Record<string, string | Uint8Array> {
  const { manifest } = recording;
  const data: Record<ArrayName, Float32Array | Int32Array | Uint8Array> = {
    ...recording.channels, latents: recording.latents, actions: recording.actions, episodes: recording.episodes, split: recording.split,
  };
  const files: Record<string, string | Uint8Array> = { [MANIFEST_FILE]: formatManifest(manifest) };
  for (const name of [...CHANNELS, ...OTHER_ARRAYS]) {
    const entry = manifest.files[arrayFile(name)];
    files[arrayFile(name)] = encodeNpy(data[name], entry.shape);
  }
  return files;
}

/** Parses manifest.json text; every problem is one line naming the file and the key. */
export function parseManifest(text: string, fileName: string): RecordingManifest {
  const json = parseJsonText(text, fileName);
  const { format, format_version: version } = (json ?? {}) as { format?: unknown; format_version?: unknown };
  if (format !== 'crosswise recording') throw new Error(`${fileName}: format: expected 'crosswise recording', got ${JSON.stringify(format) ?? 'none'}`);
  if (version !== RECORDING_FORMAT_VERSION) {
    throw new Error(`${fileName}: format_version: expected ${RECORDING_FORMAT_VERSION}, got ${JSON.stringify(version) ?? 'none'} (written by another version of crosswise; record again)`);
  }
  const manifest = checkedJson(manifestSchema, json, fileName);
  const expected = fileEntries(manifest.steps, manifestSenses(manifest), {});
  for (const [file, { shape, dtype }] of Object.entries(expected)) {
    const entry = manifest.files[file];
    if (entry == null) throw new Error(`${fileName}: files: ${file} is missing`);
    if (entry.dtype !== dtype || entry.shape.join() !== shape.join()) {
      throw new Error(`${fileName}: files.${file}: expected ${dtype} (${shape.join(', ')}) for ${manifest.steps} steps, got ${entry.dtype} (${entry.shape.join(', ')})`);
    }
  }
  return manifest;
}

/**
 * Reads a recording folder: the manifest, then every array it lists, each checked for the
 * element type and shape the manifest states. Throws one line naming the file at fault.
 */
export function readRecording(dir: string): Recording {
  const manifestPath = join(dir, MANIFEST_FILE);
  if (!existsSync(manifestPath)) throw new Error(`${dir}: not a recording (no ${MANIFEST_FILE}; crosswise record writes one)`);
  const manifest = parseManifest(readFileSync(manifestPath, 'utf8'), manifestPath);
  const read = <D extends NpyDescr>(name: ArrayName, descr: D): NpyData<D> => {
    const path = join(dir, arrayFile(name));
    if (!existsSync(path)) throw new Error(`${path}: missing (listed in ${MANIFEST_FILE})`);
    const { data, shape } = decodeNpy(new Uint8Array(readFileSync(path)), path, descr);
    const expected = manifest.files[arrayFile(name)].shape;
    if (shape.join() !== expected.join()) throw new Error(`${path}: shape (${shape.join(', ')}) differs from the manifest's (${expected.join(', ')})`);
    return data;
  };
  const channels = Object.fromEntries(CHANNELS.map((c) => [c, read(c, '<f4')])) as Record<ChannelName, Float32Array>;
  const named = (name: 'actions' | 'split', count: number) => {
    const values = read(name, '|u1');
    const t = values.findIndex((v) => v >= count);
    if (t >= 0) throw new Error(`${join(dir, arrayFile(name))}: step ${t} holds ${values[t]}, which names none of the ${count} values the manifest lists`);
    return values;
  };
  return {
    manifest, channels, latents: read('latents', '<f4'), actions: named('actions', ACTIONS.length), episodes: read('episodes', '<i4'), split: named('split', SPLIT_NAMES.length),
  };
}
