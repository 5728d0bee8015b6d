import { readFileSync } from 'node:fs';
import { closest } from 'fastest-levenshtein';
import { LineCounter, parseDocument, type Node as YamlNode } from 'yaml';
import { fileSizeProblem, INPUT_LIMITS, yamlNestingProblem } from '../input-limits.js';
import { listField, numberField, readFields, stringField, type Fields } from './fields.js';
import { readMap, type MapGrid } from './map-text.js';
import { readEmitter, readMaterial, readStart, type EmitterEntry, type MaterialEntry, type StartEntry } from './parts.js';
import { createProblems, WorldFileError, type Problems } from './problems.js';
import type { Emitter, World } from './types.js';

/** Values used when a world file leaves an optional key out. */
export const WORLD_DEFAULTS = {
  description: '',
  ambientDb: 20, // a quiet room, dB (common practice)
  wallLossDb: 25, // a light partition wall, dB per solid cell (common practice)
} as const;

const WORLD_KEYS = [
  'name', 'description', 'cell_size_m', 'ambient_db', 'wall_loss_db', 'materials', 'emitters', 'start', 'map',
];
const REQUIRED_KEYS = ['name', 'cell_size_m', 'materials', 'emitters', 'map'];
/** Cell arrays store material indices as bytes and emitter indices as 16-bit integers. */
const MAX_MATERIALS = 255;
const MAX_EMITTERS = 64;

function readList<T>(
  nodes: readonly YamlNode[] | null, read: (node: YamlNode, i: number, p: Problems) => T | null, problems: Problems,
): T[] | null {
  if (nodes == null) return null;
  const entries = nodes.map((node, i) => read(node, i, problems));
  return entries.every((e): e is T => e != null) ? entries : null;
}

/** Glyphs and names must be unique across materials and emitters together. */
function checkUnique(materials: readonly MaterialEntry[], emitters: readonly EmitterEntry[], problems: Problems): void {
  const all = [
    ...materials.map((m) => ({ what: `material '${m.material.name}'`, name: m.material.name, glyph: m.material.glyph, ...m })),
    ...emitters.map((e) => ({ what: `emitter '${e.name}'`, ...e })),
  ];
  const glyphs = new Map<string, (typeof all)[number]>();
  const names = new Map<string, (typeof all)[number]>();
  for (const entry of all) {
    const glyphOwner = glyphs.get(entry.glyph);
    if (glyphOwner != null) {
      problems.report(entry.glyphNode, `duplicate glyph '${entry.glyph}': already used by ${glyphOwner.what} at ${problems.where(glyphOwner.glyphNode)}`);
    } else glyphs.set(entry.glyph, entry);
    const nameOwner = names.get(entry.name);
    if (nameOwner != null) {
      problems.report(entry.nameNode, `duplicate name '${entry.name}': already used by the ${nameOwner.what.split(' ')[0]} at ${problems.where(nameOwner.nameNode)}`);
    } else names.set(entry.name, entry);
  }
}

/** The material index each emitter stands on, or null after reporting unknown or solid floors. */
function resolveFloors(materials: readonly MaterialEntry[], emitters: readonly EmitterEntry[], problems: Problems): number[] | null {
  const names = materials.map((m) => m.material.name);
  const floors = emitters.map((e) => {
    const index = names.indexOf(e.on);
    if (index < 0) {
      problems.report(e.onNode, `emitter '${e.name}' is on unknown material '${e.on}'; did you mean '${closest(e.on, names)}'?`);
    } else if (materials[index].material.solid) {
      problems.report(e.onNode, `emitter '${e.name}' is on solid material '${e.on}'; it must stand on a floor`);
      return null;
    }
    return index < 0 ? null : index;
  });
  return floors.every((f): f is number => f != null) ? floors : null;
}

function checkStart(start: StartEntry, grid: MapGrid, problems: Problems): boolean {
  if (start.x >= grid.width || start.y >= grid.height) {
    problems.report(start.node, `start x=${start.x}, y=${start.y} is outside the ${grid.width}×${grid.height} map`);
    return false;
  }
  if (grid.solid[start.y * grid.width + start.x] === 1) {
    problems.report(start.node, `start x=${start.x}, y=${start.y} is on a solid cell`);
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

interface Palette {
  readonly materials: MaterialEntry[];
  readonly emitters: EmitterEntry[];
  /** Material index under each emitter. */
  readonly floors: number[];
}

/** Materials and emitters, checked one by one and then against each other. */
function readPalette(fields: Fields, problems: Problems): Palette | null {
  const materials = readList(listField(fields, 'materials', problems), readMaterial, problems);
  const emitters = readList(listField(fields, 'emitters', problems), readEmitter, problems);
  if (materials != null && (materials.length === 0 || materials.length > MAX_MATERIALS)) {
    problems.report(fields.values.get('materials'), `'materials' must list 1 to ${MAX_MATERIALS} materials`);
  }
  if (emitters != null && (emitters.length === 0 || emitters.length > MAX_EMITTERS)) {
    problems.report(fields.values.get('emitters'), `'emitters' must list 1 to ${MAX_EMITTERS} emitters (sound and the nearest-emitter targets need one)`);
  }
  if (materials == null || emitters == null || problems.list.length > 0) return null;
  checkUnique(materials, emitters, problems);
  const floors = resolveFloors(materials, emitters, problems);
  return floors == null || problems.list.length > 0 ? null : { materials, emitters, floors };
}

/**
 * Reads and validates a world; returns the world (or null) and every problem found.
 * Checks run in stages (syntax, keys and values, glyphs and names, map), and a later stage
 * runs only when the earlier ones found nothing, so one mistake is not reported many times.
 */
function readWorld(text: string, path: string): { world: World | null; problems: string[] } {
  const tooDeep = yamlNestingProblem(text, path);
  if (tooDeep != null) return { world: null, problems: [tooDeep] };
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, prettyErrors: false, uniqueKeys: false });
  const problems = createProblems(path, lines);
  const failed = { world: null, problems: problems.list };
  if (doc.errors.length > 0) {
    for (const error of doc.errors) problems.report(error.pos[0], `YAML syntax: ${error.message.split('\n')[0]}`);
    return failed;
  }
  const fields = readFields(doc.contents as YamlNode | null, 'the world', WORLD_KEYS, REQUIRED_KEYS, problems);
  if (fields == null) return failed;
  const header = readHeader(fields, problems);
  const startNode = fields.values.get('start');
  const start = startNode == null ? undefined : readStart(startNode, problems);
  const palette = readPalette(fields, problems);
  if (header == null || palette == null || start === null || problems.list.length > 0) return failed;
  const { materials, emitters, floors } = palette;
  const grid = readMap(fields.values.get('map')!, text, lines, materials, emitters, floors, problems);
  if (grid == null || (start != null && !checkStart(start, grid, problems))) return failed;
  const world: World = {
    ...header,
    materials: materials.map((m) => m.material), emitters: placeEmitters(emitters, floors, grid),
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

function readWorldText(path: string): string {
  const tooLarge = fileSizeProblem(path, INPUT_LIMITS.worldBytes, 'world file');
  if (tooLarge != null) throw new WorldFileError([tooLarge]);
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    throw new WorldFileError([`${path}:1:1: cannot read the world file (${(error as NodeJS.ErrnoException).code ?? String(error)})`]);
  }
}
