import { isScalar, Scalar, type LineCounter, type Node as YamlNode } from 'yaml';
import type { EmitterEntry, MaterialEntry } from './parts.js';
import type { Problems } from './problems.js';

/** Largest accepted map side, in cells. */
export const MAX_MAP_SIDE = 256;

/** The cell arrays of a validated map (row-major, index = y * width + x). */
export interface MapGrid {
  readonly width: number;
  readonly height: number;
  readonly material: Uint8Array;
  readonly solid: Uint8Array;
  readonly emitterAt: Int16Array;
  /** Position of each emitter, in emitter order. */
  readonly emitterCells: readonly { readonly x: number; readonly y: number }[];
}

/** The map's rows with the file offset of each row's first character. */
interface MapRows {
  readonly rows: readonly string[];
  readonly offsets: readonly number[];
}

/**
 * Splits a `map: |` literal block into rows and finds where each row starts in the file.
 *
 * A literal block keeps every line as written after removing one common indentation, so
 * row i sits on the i-th line after the `|` header (YAML 1.2 §8.1.2).
 */
function mapRows(node: YamlNode, text: string, lines: LineCounter, problems: Problems): MapRows | null {
  if (!isScalar(node) || node.type !== Scalar.BLOCK_LITERAL || typeof node.value !== 'string') {
    problems.report(node, "'map' must be a literal block: write 'map: |' and the rows below it, indented");
    return null;
  }
  const rows = node.value.split('\n');
  while (rows.length > 0 && rows[rows.length - 1] === '') rows.pop();
  const headerLine = lines.linePos(node.range![0]).line;
  const offsets = rows.map((row, i) => {
    const start = lines.lineStarts[headerLine + i];
    const end = lines.lineStarts[headerLine + i + 1] ?? text.length;
    const sourceLine = text.slice(start, end).replace(/\r?\n$/, '');
    return start + Math.max(0, sourceLine.length - row.length);
  });
  return { rows, offsets };
}

type GlyphMeaning = { readonly kind: 'material' | 'emitter'; readonly index: number };

function glyphTable(materials: readonly MaterialEntry[], emitters: readonly EmitterEntry[]): Map<string, GlyphMeaning> {
  const table = new Map<string, GlyphMeaning>();
  emitters.forEach((e, index) => table.set(e.glyph, { kind: 'emitter', index }));
  materials.forEach((m, index) => table.set(m.material.glyph, { kind: 'material', index }));
  return table;
}

function checkShape(node: YamlNode, { rows, offsets }: MapRows, problems: Problems): boolean {
  if (rows.length === 0) {
    problems.report(node, "'map' has no rows");
    return false;
  }
  const width = rows[0].length;
  if (rows.length > MAX_MAP_SIDE || width > MAX_MAP_SIDE) {
    problems.report(node, `map is ${width}×${rows.length} cells; the largest allowed is ${MAX_MAP_SIDE}×${MAX_MAP_SIDE}`);
    return false;
  }
  let even = true;
  rows.forEach((row, y) => {
    if (row.length !== width) {
      problems.report(offsets[y], `ragged map: row ${y} has ${row.length} cells but row 0 has ${width}`);
      even = false;
    }
  });
  return even;
}

/** Glyph tables for filling the grid: what each glyph means and the floor under each emitter. */
interface Legend {
  readonly materials: readonly MaterialEntry[];
  readonly emitters: readonly EmitterEntry[];
  readonly onMaterial: readonly number[];
}

/**
 * Fills the cell arrays from the rows, reporting unknown glyphs and emitters placed twice or
 * not at all. Each emitter glyph must appear exactly once: an emitter is one sound source at
 * one place, so a second copy is reported rather than silently becoming a second source.
 */
function fillCells({ rows, offsets }: MapRows, legend: Legend, problems: Problems): MapGrid | null {
  const { materials, emitters, onMaterial } = legend;
  const width = rows[0].length;
  const height = rows.length;
  const glyphs = glyphTable(materials, emitters);
  const material = new Uint8Array(width * height);
  const solid = new Uint8Array(width * height);
  const emitterAt = new Int16Array(width * height).fill(-1);
  const emitterCells: { x: number; y: number }[] = [];
  const placedAt = new Map<number, number>(); // emitter index -> file offset of its glyph
  const before = problems.list.length;
  for (let i = 0; i < width * height; i++) {
    const x = i % width;
    const y = Math.floor(i / width);
    const glyph = rows[y][x];
    const meaning = glyphs.get(glyph);
    const offset = offsets[y] + x;
    if (meaning == null) {
      problems.report(offset, `unknown glyph ${JSON.stringify(glyph)} in map at x=${x}, y=${y}: not a material or emitter glyph`);
    } else if (meaning.kind === 'material') {
      material[i] = meaning.index;
      solid[i] = materials[meaning.index].material.solid ? 1 : 0;
    } else if (placedAt.has(meaning.index)) {
      problems.report(offset, `emitter '${emitters[meaning.index].name}' (glyph '${glyph}') appears again at x=${x}, y=${y}; `
        + `it was already placed at ${problems.where(placedAt.get(meaning.index))}, and each emitter is one source`);
    } else {
      placedAt.set(meaning.index, offset);
      emitterCells[meaning.index] = { x, y };
      material[i] = onMaterial[meaning.index];
      solid[i] = emitters[meaning.index].solid ? 1 : 0;
      emitterAt[i] = meaning.index;
    }
  }
  emitters.forEach((e, index) => {
    if (!placedAt.has(index)) problems.report(e.glyphNode, `emitter '${e.name}' (glyph '${e.glyph}') does not appear in the map`);
  });
  return problems.list.length > before ? null : { width, height, material, solid, emitterAt, emitterCells };
}

/** Validates the `map` block against the glyphs and builds the cell arrays. */
export function readMap(
  node: YamlNode, text: string, lines: LineCounter,
  materials: readonly MaterialEntry[], emitters: readonly EmitterEntry[], onMaterial: readonly number[],
  problems: Problems,
): MapGrid | null {
  const layout = mapRows(node, text, lines, problems);
  if (layout == null || !checkShape(node, layout, problems)) return null;
  const grid = fillCells(layout, { materials, emitters, onMaterial }, problems);
  return grid != null && checkEnclosure(grid, node, layout.offsets, problems) ? grid : null;
}

/** An open border lets the agent walk off the map; a map with no free cell has nowhere to stand. */
function checkEnclosure(grid: MapGrid, node: YamlNode, offsets: readonly number[], problems: Problems): boolean {
  const { width, height, solid } = grid;
  let closed = true;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const onBorder = x === 0 || y === 0 || x === width - 1 || y === height - 1;
      if (onBorder && solid[y * width + x] === 0) {
        problems.report(offsets[y] + x, `open border at x=${x}, y=${y}: the edge cell is not solid, so the agent could walk off the map`);
        closed = false;
      }
    }
  }
  if (!solid.includes(0)) {
    problems.report(node, 'the map has no free cell: every cell is solid, so the agent has nowhere to stand');
    return false;
  }
  return closed;
}
