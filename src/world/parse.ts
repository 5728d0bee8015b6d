import { readFileSync } from 'node:fs';
import { LineCounter, parseDocument, type Node as YamlNode } from 'yaml';
import { fileSizeProblem, INPUT_LIMITS, yamlNestingProblem } from '../input-limits.js';
import { itemPath, listField, numberField, readFields, stringField, type Fields } from './fields.js';
import { readMap, type MapGrid, type MapLegend } from './map-text.js';
import { paletteItem, readEmitter, readMaterial, readStart, type EmitterEntry, type PaletteItem, type StartEntry } from './parts.js';
import { createProblems, WorldFileError, type Problems } from './problems.js';
import { suggestion } from './spelling.js';
import type { Emitter, Material, World } from './types.js';

/** Values used when a world file leaves an optional key out. */
export const WORLD_DEFAULTS = {
  description: '',
  ambientDb: 20, // a quiet room, dB (common practice)
  wallLossDb: 25, // a light partition wall, dB per solid cell (common practice)
} as const;

/** The top-level keys of a world file. */
export const WORLD_KEYS: readonly string[] = [
  'name', 'description', 'cell_size_m', 'ambient_db', 'wall_loss_db', 'materials', 'emitters', 'start', 'map',
];
const REQUIRED_KEYS = ['name', 'cell_size_m', 'materials', 'emitters', 'map'];
/** Cell arrays store material indices as bytes and emitter indices as 16-bit integers. */
const MAX_MATERIALS = 255;
const MAX_EMITTERS = 64;

/** Glyphs and names must be unique across materials and emitters together. */
function checkUnique(items: readonly PaletteItem[], problems: Problems): void {
  for (const key of ['glyph', 'name'] as const) {
    const owners = new Map<string, PaletteItem>();
    for (const item of items) {
      const value = item[key];
      if (value == null) continue;
      const owner = owners.get(value);
      if (owner == null) owners.set(value, item);
      else problems.report(item.nodes.get(key), `${item.path}.${key}: duplicate ${key} '${value}': already used by ${owner.path} at ${problems.where(owner.nodes.get(key))}`);
    }
  }
}

/**
 * The material index under each emitter (null where unknown), after reporting emitters on an
 * unknown or solid material. Unknown is only said when every material's name could be read.
 */
function resolveFloors(materials: readonly PaletteItem[], emitters: readonly PaletteItem[], problems: Problems): (number | null)[] {
  const names = materials.map((m) => m.name);
  const allNamed = names.every((name) => name != null);
  return emitters.map((e) => {
    if (e.on == null) return null;
    const index = names.indexOf(e.on);
    if (index < 0) {
      if (allNamed) problems.report(e.nodes.get('on'), `${e.path}.on: unknown material '${e.on}'${suggestion(e.on, names as string[])}`);
      return null;
    }
    if (materials[index].solid === true) {
      problems.report(e.nodes.get('on'), `${e.path}.on: material '${e.on}' is solid; an emitter stands on a floor`);
      return null;
    }
    return index;
  });
}

/** The map's legend, when every glyph and solid flag is readable and the glyphs are distinct; else null (the map cannot be read). */
function mapLegend(materials: readonly PaletteItem[], emitters: readonly PaletteItem[], floors: readonly (number | null)[]): MapLegend | null {
  const items = [...materials, ...emitters];
  const glyphs = items.map((item) => item.glyph);
  if (items.some((item) => item.glyph == null || item.solid == null) || new Set(glyphs).size < glyphs.length) return null;
  return {
    materials: materials.map((m) => ({ glyph: m.glyph as string, solid: m.solid as boolean })),
    emitters: emitters.map((e) => ({ path: e.path, name: e.name ?? e.path, glyph: e.glyph as string, solid: e.solid as boolean, glyphNode: e.nodes.get('glyph') as YamlNode })),
    onMaterial: floors.map((floor) => floor ?? 0),
  };
}

function checkStart(start: StartEntry, grid: MapGrid, problems: Problems): boolean {
  if (start.x >= grid.width || start.y >= grid.height) {
    problems.report(start.node, `start: x=${start.x}, y=${start.y} is outside the ${grid.width}×${grid.height} map`);
    return false;
  }
  if (grid.solid[start.y * grid.width + start.x] === 1) {
    problems.report(start.node, `start: x=${start.x}, y=${start.y} is on a solid cell`);
    return false;
  }
  return true;
}

function placeEmitters(entries: readonly EmitterEntry[], floors: readonly number[], grid: MapGrid): Emitter[] {
  return entries.map((e, i) => ({
    name: e.name, glyph: e.glyph, onMaterial: floors[i], solid: e.solid, colour: e.colour,
    ...e.band, periodSteps: e.periodSteps, duty: e.duty, x: grid.emitterCells[i].x, y: grid.emitterCells[i].y,
  }));
}

type Header = Pick<World, 'name' | 'description' | 'cellSizeM' | 'ambientDb' | 'wallLossDb'>;

function readHeader(fields: Fields, problems: Problems): Header | null {
  const name = stringField(fields, 'name', problems);
  const description = stringField(fields, 'description', problems, { fallback: WORLD_DEFAULTS.description });
  const cellSizeM = numberField(fields, 'cell_size_m', { above: 0, max: 100 }, problems);
  const ambientDb = numberField(fields, 'ambient_db', { min: -20, max: 140 }, problems, WORLD_DEFAULTS.ambientDb);
  const wallLossDb = numberField(fields, 'wall_loss_db', { min: 0, max: 200 }, problems, WORLD_DEFAULTS.wallLossDb);
  if (name == null || description == null || cellSizeM == null || ambientDb == null || wallLossDb == null) return null;
  return { name, description, cellSizeM, ambientDb, wallLossDb };
}

/** Materials and emitters as read, each null where invalid, and the map's legend when the glyphs can be read. */
interface Palette {
  readonly materials: readonly (Material | null)[];
  readonly emitters: readonly (EmitterEntry | null)[];
  /** Material index under each emitter, null where unknown. */
  readonly floors: readonly (number | null)[];
  readonly legend: MapLegend | null;
}

/**
 * Materials and emitters, each checked on its own and then against each other: a problem
 * in one item (a misspelt key, a value out of range) does not hide a problem between items.
 */
function readPalette(fields: Fields, problems: Problems): Palette {
  const list = (key: 'materials' | 'emitters', max: number, what: string) => {
    const nodes = listField(fields, key, problems);
    if (nodes != null && (nodes.length === 0 || nodes.length > max)) {
      problems.report(fields.values.get(key), `${key}: expected 1 to ${max} ${what}, got ${nodes.length}`);
    }
    return (nodes ?? []).map((node, i) => ({ node, path: itemPath(key, i, node) }));
  };
  const materialNodes = list('materials', MAX_MATERIALS, 'materials');
  const emitterNodes = list('emitters', MAX_EMITTERS, 'emitters (sound and the nearest-emitter targets need one)');
  const materials = materialNodes.map(({ node, path }) => readMaterial(node, path, problems));
  const emitters = emitterNodes.map(({ node, path }) => readEmitter(node, path, problems));
  const materialItems = materialNodes.map(({ node, path }) => paletteItem(node, path, false));
  const emitterItems = emitterNodes.map(({ node, path }) => paletteItem(node, path, true));
  checkUnique([...materialItems, ...emitterItems], problems);
  const floors = resolveFloors(materialItems, emitterItems, problems);
  const complete = materialItems.length > 0 && fields.values.has('emitters');
  return { materials, emitters, floors, legend: complete ? mapLegend(materialItems, emitterItems, floors) : null };
}

/**
 * Reads and validates a world; returns the world (or null) and every problem found.
 * Each part is checked whatever is wrong with another, as long as it can be read: the
 * header, the start, every material and emitter, their glyphs and names across the lists,
 * and the map whenever its glyphs are known. Only YAML syntax errors stop the rest.
 */
function readWorld(text: string, path: string): { world: World | null; problems: string[] } {
  const tooDeep = yamlNestingProblem(text, path);
  if (tooDeep != null) return { world: null, problems: [tooDeep] };
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, prettyErrors: false, uniqueKeys: false });
  const problems = createProblems(path, lines);
  const failed = () => ({ world: null, problems: problems.inFileOrder() });
  if (doc.errors.length > 0) {
    for (const error of doc.errors) problems.report(error.pos[0], `YAML syntax: ${error.message.split('\n')[0]}`);
    return failed();
  }
  const fields = readFields(doc.contents as YamlNode | null, '', WORLD_KEYS, REQUIRED_KEYS, problems);
  if (fields == null) return failed();
  const header = readHeader(fields, problems);
  const startNode = fields.values.get('start');
  const start = startNode == null ? undefined : readStart(startNode, problems);
  const palette = readPalette(fields, problems);
  const mapNode = fields.values.get('map');
  const grid = mapNode == null || palette.legend == null ? null : readMap(mapNode, text, lines, palette.legend, problems);
  if (grid != null && start != null) checkStart(start, grid, problems);
  if (problems.list.length > 0 || header == null || grid == null || start === null) return failed();
  const world: World = {
    ...header,
    materials: palette.materials as Material[],
    emitters: placeEmitters(palette.emitters as EmitterEntry[], palette.floors as number[], grid),
    width: grid.width, height: grid.height, material: grid.material, solid: grid.solid, emitterAt: grid.emitterAt,
    ...(start != null ? { start: { x: start.x, y: start.y, heading: start.heading } } : {}),
  };
  return { world, problems: problems.list };
}

/** Every problem in a world file's text as `path:line:col: reason` lines; empty when valid. */
export function checkWorldText(text: string, path: string): string[] {
  return readWorld(text, path).problems;
}

/** Every problem in the world file at `path`; empty when valid. */
export function checkWorldFile(path: string): string[] {
  try {
    return checkWorldText(readWorldText(path), path);
  } catch (error) {
    if (error instanceof WorldFileError) return [...error.problems];
    throw error;
  }
}

/** Parses and validates world text; throws WorldFileError listing every problem. */
export function parseWorld(text: string, path: string): World {
  const { world, problems } = readWorld(text, path);
  if (world == null || problems.length > 0) throw new WorldFileError(problems);
  return world;
}

/** Loads a world file; throws WorldFileError listing every problem. */
export function loadWorld(path: string): World {
  return parseWorld(readWorldText(path), path);
}

/** The text of a world file; throws WorldFileError with one line when it cannot be read. */
export function readWorldText(path: string): string {
  const tooLarge = fileSizeProblem(path, INPUT_LIMITS.worldBytes, 'world file');
  if (tooLarge != null) throw new WorldFileError([tooLarge]);
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    throw new WorldFileError([`${path}:1:1: cannot read the world file (${(error as NodeJS.ErrnoException).code ?? String(error)})`]);
  }
}
