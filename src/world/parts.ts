import type { Node as YamlNode } from 'yaml';
import {
  booleanField, numberField, readFields, stringField, vectorField, type Fields, type NumberRule,
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

/** A material together with the nodes later checks point at. */
export interface MaterialEntry {
  readonly material: Material;
  readonly nameNode: YamlNode;
  readonly glyphNode: YamlNode;
}

/** An emitter as written, before its map position is known. */
export interface EmitterEntry {
  readonly name: string;
  readonly glyph: string;
  readonly on: string;
  readonly solid: boolean;
  readonly colour: Colour;
  readonly band: SoundBand;
  readonly periodSteps: number;
  readonly duty: number;
  readonly nameNode: YamlNode;
  readonly glyphNode: YamlNode;
  readonly onNode: YamlNode;
}

/** A start pose as written, with its node for the "start on a solid cell" check. */
export interface StartEntry {
  readonly x: number;
  readonly y: number;
  readonly heading: Heading;
  readonly node: YamlNode;
}

function soundBand(fields: Fields, problems: Problems): SoundBand | null {
  const centreHz = numberField(fields, 'centre_hz', HEARING_HZ, problems);
  const bandwidthOctaves = numberField(fields, 'bandwidth_octaves', OCTAVES, problems);
  const levelDb = numberField(fields, 'level_db', LEVEL_DB, problems);
  if (centreHz == null || bandwidthOctaves == null || levelDb == null) return null;
  return { centreHz, bandwidthOctaves, levelDb };
}

/** Reads one entry of `materials`; null (after reporting) when it is invalid. */
export function readMaterial(node: YamlNode, index: number, problems: Problems): MaterialEntry | null {
  const fields = readFields(node, `material ${index + 1}`, MATERIAL_KEYS, ['name', 'glyph', 'colour'], problems);
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
    const sub = readFields(footstepNode, `the footstep of material ${index + 1}`, SOUND_KEYS, SOUND_KEYS, problems);
    footstep = sub == null ? null : soundBand(sub, problems);
  }
  if (name == null || glyph == null || colour == null || texture == null || footstep === null) return null;
  const material: Material = {
    name, glyph, solid, colour: colour as unknown as Colour, texture,
    ...(footstep != null ? { footstep } : {}),
  };
  return { material, nameNode: fields.values.get('name')!, glyphNode: fields.values.get('glyph')! };
}

/** Reads one entry of `emitters`; null (after reporting) when it is invalid. */
export function readEmitter(node: YamlNode, index: number, problems: Problems): EmitterEntry | null {
  const required = ['name', 'glyph', 'on', 'colour', ...SOUND_KEYS];
  const fields = readFields(node, `emitter ${index + 1}`, EMITTER_KEYS, required, problems);
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
  return {
    name, glyph, on, solid, colour: colour as unknown as Colour, band, periodSteps, duty,
    nameNode: fields.values.get('name')!, glyphNode: fields.values.get('glyph')!, onNode: fields.values.get('on')!,
  };
}

/** Reads the optional `start` pose (bounds are checked against the map later). */
export function readStart(node: YamlNode, problems: Problems): StartEntry | null {
  const fields = readFields(node, 'start', START_KEYS, START_KEYS, problems);
  if (fields == null) return null;
  const x = numberField(fields, 'x', { min: 0, integer: true }, problems);
  const y = numberField(fields, 'y', { min: 0, integer: true }, problems);
  const heading = stringField(fields, 'heading', problems);
  if (heading != null && !(HEADINGS as readonly string[]).includes(heading)) {
    problems.report(fields.values.get('heading'), `'heading' in start must be one of ${HEADINGS.join(', ')}, got '${heading}'`);
    return null;
  }
  if (x == null || y == null || heading == null) return null;
  return { x, y, heading: heading as Heading, node };
}
