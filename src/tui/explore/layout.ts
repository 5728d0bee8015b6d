/** A panel to place, by its size in terminal cells. */
export interface Block {
  readonly id: string;
  readonly width: number;
  readonly height: number;
  /** A block this one continues: it goes only in a column right of that block's. */
  readonly follows?: string;
}

/** One column of panels right of the map. */
export interface BlockColumn {
  readonly width: number;
  readonly ids: readonly string[];
  /** Rows the column's panels take. */
  readonly height: number;
}

/** Where the panels go, and what is left for the map. */
export interface Placement {
  readonly columns: readonly BlockColumn[];
  /** Ids that fit nowhere, in priority order. */
  readonly hidden: readonly string[];
  /** Terminal columns left for the map. */
  readonly mapColumns: number;
}

/** Blank columns between neighbouring columns. */
export const COLUMN_GAP = 2;

/**
 * Places blocks, most important first, in columns right of the map, none taller than
 * `height` rows: each block goes into the first column with room below (widening it if
 * the map keeps `minMapColumns`), else into a new column if the map keeps them; a block
 * that fits nowhere, or continues a hidden one, is hidden. The map gets the columns left over, at most `wantedMapColumns`.
 */
export function placeBlocks(
  blocks: readonly Block[],
  area: { readonly columns: number; readonly height: number; readonly minMapColumns: number; readonly wantedMapColumns: number },
): Placement {
  const columns: { width: number; height: number; ids: string[] }[] = [];
  const hidden: string[] = [];
  const used = () => columns.reduce((sum, c) => sum + c.width + COLUMN_GAP, 0);
  const mapKeeps = (extraWidth: number) => area.columns - used() - extraWidth >= area.minMapColumns;
  for (const block of blocks) {
    const first = block.follows == null ? 0 : columns.findIndex((c) => c.ids.includes(block.follows as string)) + 1;
    if (first === 0 && block.follows != null) {
      hidden.push(block.id);
      continue;
    }
    const column = block.height > area.height
      ? undefined
      : columns.slice(first).find((c) => c.height + block.height <= area.height && mapKeeps(Math.max(0, block.width - c.width)));
    if (column != null) {
      column.ids.push(block.id);
      column.height += block.height;
      column.width = Math.max(column.width, block.width);
    } else if (block.height <= area.height && mapKeeps(block.width + COLUMN_GAP)) {
      columns.push({ width: block.width, height: block.height, ids: [block.id] });
    } else {
      hidden.push(block.id);
    }
  }
  const mapColumns = Math.max(0, Math.min(area.wantedMapColumns, area.columns - used()));
  return { columns, hidden, mapColumns };
}
