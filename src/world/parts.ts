import { isMap, isScalar, type Node as YamlNode } from 'yaml';
import {
  booleanField, keyPath, numberField, readFields, stringField, vectorField, type Fields, type NumberRule,
} from './fields.js';
import type { Problems } from './problems.js';
import { HEADINGS, TEXTURE_SIZE, type Colour, type Heading, type Material, type SoundBand } from './types.js';

const UNIT: NumberRule = { min: 0, max: 1 };
/** The range of human hearing (common practice: 20 Hz to 20 kHz). */
const HEARING_HZ: NumberRule = { min: 20, max: 20000 };
const OCTAVES: NumberRule = { above: 0, max: 10 };
/** From below the threshold of hearing to beyond the threshold of pain (common practice). */
const LEVEL_DB: NumberRule = { min: -20, max: 140 };

const SOUND_KEYS = ['centre_hz', 'bandwidth_octaves', 'level_db'] as const;
const MATERIAL_KEYS = ['name', 'glyph', 'solid', 'colour', 'texture', 'footstep'];
const EMITTER_KEYS = ['name', 'glyph', 'on', 'solid', 'colour', ...SOUND_KEYS, 'period_steps', 'duty'];
const START_KEYS = ['x', 'y', 'heading'];

/** An emitter as written, before its map position is known. */
export interface EmitterEntry {
  readonly name: string;
  readonly glyph: string;
  readonly solid: boolean;
  readonly colour: Colour;
  readonly band: SoundBand;
  readonly periodSteps: number;
  readonly duty: number;
}

/**
 * What the checks across materials, emitters and the map need of one list item, read
 * whether or not the rest of the item is valid (its own problems are reported once, by
 * readMaterial or readEmitter); a key that is missing or malformed is undefined.
 */
export interface PaletteItem {
  /** The item's key path: `materials.1 (boards)`. */
  readonly path: string;
  readonly name?: string;
  readonly glyph?: string;
  readonly solid?: boolean;
  /** Emitters only: the material it stands on. */
  readonly on?: string;
  readonly node: YamlNode;
  readonly nodes: ReadonlyMap<string, YamlNode>;
}

/** The identity of a material or emitter; `solid` falls back to `solidByDefault` when absent. */
export function paletteItem(node: YamlNode, path: string, solidByDefault: boolean): PaletteItem {
  const nodes = new Map<string, YamlNode>();
  if (isMap(node)) {
    for (const pair of node.items) if (isScalar(pair.key) && pair.value != null) nodes.set(String(pair.key.value), pair.value as YamlNode);
  }
  const scalar = (key: string) => {
    const value = nodes.get(key);
    return isScalar(value) ? value.value : undefined;
  };
  const text = (key: string) => {
    const value = scalar(key);
    return typeof value === 'string' || typeof value === 'number' ? String(value) : undefined;
  };
  const glyph = text('glyph');
  const solid = nodes.has('solid') ? scalar('solid') : solidByDefault;
  return {
    path, node, nodes, name: text('name'),
    glyph: glyph?.length === 1 && !/\s/.test(glyph) ? glyph : undefined,
    solid: typeof solid === 'boolean' ? solid : undefined,
    on: text('on'),
  };
}

function soundBand(fields: Fields, problems: Problems): SoundBand | null {
  const centreHz = numberField(fields, 'centre_hz', HEARING_HZ, problems);
  const bandwidthOctaves = numberField(fields, 'bandwidth_octaves', OCTAVES, problems);
  const levelDb = numberField(fields, 'level_db', LEVEL_DB, problems);
  if (centreHz == null || bandwidthOctaves == null || levelDb == null) return null;
  return { centreHz, bandwidthOctaves, levelDb };
}

/** Reads one entry of `materials` at key path `at`; null (after reporting) when it is invalid. */
export function readMaterial(node: YamlNode, at: string, problems: Problems): Material | null {
  const fields = readFields(node, at, MATERIAL_KEYS, ['name', 'glyph', 'colour'], problems);
  if (fields == null) return null;
  const name = stringField(fields, 'name', problems);
  const glyph = stringField(fields, 'glyph', problems, { oneChar: true });
  const solid = booleanField(fields, 'solid', problems, false);
  const colour = vectorField(fields, 'colour', 3, UNIT, problems);
  const texture = fields.values.has('texture')
    ? vectorField(fields, 'texture', TEXTURE_SIZE, UNIT, problems)
    : new Array<number>(TEXTURE_SIZE).fill(0);
  const footstepNode = fields.values.get('footstep');
  let footstep: SoundBand | null | undefined;
  if (footstepNode != null) {
    const sub = readFields(footstepNode, keyPath(at, 'footstep'), SOUND_KEYS, SOUND_KEYS, problems);
    footstep = sub == null ? null : soundBand(sub, problems);
  }
  if (name == null || glyph == null || colour == null || texture == null || footstep === null) return null;
  return { name, glyph, solid, colour: colour as unknown as Colour, texture, ...(footstep != null ? { footstep } : {}) };
}

/** Reads one entry of `emitters` at key path `at`; null (after reporting) when it is invalid. */
export function readEmitter(node: YamlNode, at: string, problems: Problems): EmitterEntry | null {
  const required = ['name', 'glyph', 'on', 'colour', ...SOUND_KEYS];
  const fields = readFields(node, at, EMITTER_KEYS, required, problems);
  if (fields == null) return null;
  const name = stringField(fields, 'name', problems);
  const glyph = stringField(fields, 'glyph', problems, { oneChar: true });
  const on = stringField(fields, 'on', problems);
  const solid = booleanField(fields, 'solid', problems, true);
  const colour = vectorField(fields, 'colour', 3, UNIT, problems);
  const band = soundBand(fields, problems);
  const periodSteps = numberField(fields, 'period_steps', { min: 0, max: 1e6, integer: true }, problems, 0);
  const duty = numberField(fields, 'duty', UNIT, problems, 1);
  if (name == null || glyph == null || on == null || colour == null || band == null
    || periodSteps == null || duty == null) return null;
  return { name, glyph, solid, colour: colour as unknown as Colour, band, periodSteps, duty };
}

/** A start pose as written, with its node for the "start on a solid cell" check. */
export interface StartEntry {
  readonly x: number;
  readonly y: number;
  readonly heading: Heading;
  readonly node: YamlNode;
}

/** Reads the optional `start` pose (bounds are checked against the map later). */
export function readStart(node: YamlNode, problems: Problems): StartEntry | null {
  const fields = readFields(node, 'start', START_KEYS, START_KEYS, problems);
  if (fields == null) return null;
  const x = numberField(fields, 'x', { min: 0, integer: true }, problems);
  const y = numberField(fields, 'y', { min: 0, integer: true }, problems);
  const heading = stringField(fields, 'heading', problems);
  if (heading != null && !(HEADINGS as readonly string[]).includes(heading)) {
    problems.report(fields.values.get('heading'), `start.heading: expected one of ${HEADINGS.join(', ')}, got '${heading}'`);
    return null;
  }
  if (x == null || y == null || heading == null) return null;
  return { x, y, heading: heading as Heading, node };
}
