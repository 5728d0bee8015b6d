import { isScalar, Scalar, type LineCounter, type Node as YamlNode } from 'yaml';
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
    problems.report(node, "map: expected a literal block: write 'map: |' and the rows below it, indented");
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

function glyphTable({ materials, emitters }: MapLegend): Map<string, GlyphMeaning> {
  const table = new Map<string, GlyphMeaning>();
  emitters.forEach((e, index) => table.set(e.glyph, { kind: 'emitter', index }));
  materials.forEach((m, index) => table.set(m.glyph, { kind: 'material', index }));
  return table;
}

/** `x=3` for one cell, `x=3..7` for a run. */
function span(first: number, last: number): string {
  return first === last ? String(first) : `${first}..${last}`;
}

function checkShape(node: YamlNode, { rows, offsets }: MapRows, problems: Problems): boolean {
  if (rows.length === 0) {
    problems.report(node, 'map: expected at least one row, got none');
    return false;
  }
  const width = rows[0].length;
  if (rows.length > MAX_MAP_SIDE || width > MAX_MAP_SIDE) {
    problems.report(node, `map: ${width}×${rows.length} cells; the largest allowed is ${MAX_MAP_SIDE}×${MAX_MAP_SIDE}`);
    return false;
  }
  let even = true;
  rows.forEach((row, y) => {
    if (row.length !== width) {
      problems.report(offsets[y], `map: ragged: row ${y} has ${row.length} cells but row 0 has ${width}`);
      even = false;
    }
  });
  return even;
}

/** What each glyph of the map stands for: materials and emitters in file order, and the floor under each emitter. */
export interface MapLegend {
  readonly materials: readonly { readonly glyph: string; readonly solid: boolean }[];
  readonly emitters: readonly { readonly path: string; readonly name: string; readonly glyph: string; readonly solid: boolean; readonly glyphNode: YamlNode }[];
  /** Material index under each emitter (0 when it is not known: the grid is then not used). */
  readonly onMaterial: readonly number[];
}

/**
 * Fills the cell arrays from the rows, reporting unknown glyphs (one line per run of cells
 * in a row) and emitters placed twice or not at all. Each emitter glyph must appear exactly
 * once: an emitter is one sound source at one place, so a second copy is reported rather
 * than silently becoming a second source.
 */
function fillCells({ rows, offsets }: MapRows, legend: MapLegend, problems: Problems): MapGrid | null {
  const { materials, emitters, onMaterial } = legend;
  const width = rows[0].length;
  const height = rows.length;
  const glyphs = glyphTable(legend);
  const material = new Uint8Array(width * height);
  const solid = new Uint8Array(width * height);
  const emitterAt = new Int16Array(width * height).fill(-1);
  const emitterCells: { x: number; y: number }[] = [];
  const placedAt = new Map<number, number>(); // emitter index -> file offset of its glyph
  const before = problems.list.length;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const glyph = rows[y][x];
      const meaning = glyphs.get(glyph);
      const offset = offsets[y] + x;
      if (meaning == null) {
        let last = x;
        while (last + 1 < width && rows[y][last + 1] === glyph) last++;
        problems.report(offset, `map: unknown glyph ${JSON.stringify(glyph)} at x=${span(x, last)}, y=${y}: not a material or emitter glyph`);
        x = last;
      } else if (meaning.kind === 'material') {
        material[i] = meaning.index;
        solid[i] = materials[meaning.index].solid ? 1 : 0;
      } else if (placedAt.has(meaning.index)) {
        problems.report(offset, `map: emitter '${emitters[meaning.index].name}' (glyph '${glyph}') appears again at x=${x}, y=${y}; `
          + `it was already placed at ${problems.where(placedAt.get(meaning.index))}, and each emitter is one source`);
      } else {
        placedAt.set(meaning.index, offset);
        emitterCells[meaning.index] = { x, y };
        material[i] = onMaterial[meaning.index];
        solid[i] = emitters[meaning.index].solid ? 1 : 0;
        emitterAt[i] = meaning.index;
      }
    }
  }
  emitters.forEach((e, index) => {
    if (!placedAt.has(index)) problems.report(e.glyphNode, `${e.path}.glyph: '${e.glyph}' does not appear in the map; each emitter is placed once`);
  });
  return problems.list.length > before ? null : { width, height, material, solid, emitterAt, emitterCells };
}

/** Validates the `map` block against the glyphs and builds the cell arrays. */
export function readMap(node: YamlNode, text: string, lines: LineCounter, legend: MapLegend, problems: Problems): MapGrid | null {
  const layout = mapRows(node, text, lines, problems);
  if (layout == null || !checkShape(node, layout, problems)) return null;
  const grid = fillCells(layout, legend, problems);
  return grid != null && checkEnclosure(grid, node, layout.offsets, problems) ? grid : null;
}

/**
 * An open border lets the agent walk off the map (one line per run of open edge cells); a
 * map with no free cell has nowhere to stand.
 */
function checkEnclosure(grid: MapGrid, node: YamlNode, offsets: readonly number[], problems: Problems): boolean {
  const { width, height, solid } = grid;
  const open = (x: number, y: number) => solid[y * width + x] === 0;
  let closed = true;
  const report = (x0: number, x1: number, y0: number, y1: number) => {
    const cells = x0 === x1 && y0 === y1 ? 'the edge cell is' : 'the edge cells are';
    problems.report(offsets[y0] + x0, `map: open border at x=${span(x0, x1)}, y=${span(y0, y1)}: ${cells} not solid, so the agent could walk off the map`);
    closed = false;
  };
  // Rows 0 and height−1 whole, then columns 0 and width−1 between them: each edge cell once.
  for (const y of height === 1 ? [0] : [0, height - 1]) {
    for (let x = 0; x < width; x++) {
      if (!open(x, y)) continue;
      const first = x;
      while (x + 1 < width && open(x + 1, y)) x++;
      report(first, x, y, y);
    }
  }
  for (const x of width === 1 ? [0] : [0, width - 1]) {
    for (let y = 1; y < height - 1; y++) {
      if (!open(x, y)) continue;
      const first = y;
      while (y + 1 < height - 1 && open(x, y + 1)) y++;
      report(x, x, first, y);
    }
  }
  if (!solid.includes(0)) {
    problems.report(node, 'map: no free cell: every cell is solid, so the agent has nowhere to stand');
    return false;
  }
  return closed;
}
