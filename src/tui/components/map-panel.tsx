import { Box, Text } from 'ink';

/** How a map cell stands out: the agent, a cell the agent sees, a sounding or silent emitter. */
export type MapMark = 'agent' | 'view' | 'sounding' | 'silent' | 'plain';

/** One map cell: its glyph and how it is marked. */
export interface MapCell {
  readonly glyph: string;
  readonly mark: MapMark;
  /** An ink colour for the glyph; absent without colour. */
  readonly color?: string;
}

/** Consecutive cells of one mark, drawn as one piece of text. */
function runs(row: readonly MapCell[]): { text: string; mark: MapMark; color?: string }[] {
  const out: { text: string; mark: MapMark; color?: string }[] = [];
  for (const cell of row) {
    const last = out[out.length - 1];
    if (last != null && last.mark === cell.mark && last.color === cell.color) last.text += cell.glyph;
    else out.push({ text: cell.glyph, mark: cell.mark, color: cell.color });
  }
  return out;
}

/**
 * The world map; marks use text attributes only (bold, reverse video, dim), so they
 * survive a terminal without colour.
 */
export function MapPanel({ rows }: { readonly rows: readonly (readonly MapCell[])[] }) {
  return (
    <Box flexDirection="column">
      {rows.map((row, y) => (
        <Text key={y}>
          {runs(row).map((run, i) => (
            <Text key={i} color={run.color} bold={run.mark === 'agent' || run.mark === 'sounding'} inverse={run.mark === 'view' || run.mark === 'agent'} dimColor={run.mark === 'silent'}>
              {run.text}
            </Text>
          ))}
        </Text>
      ))}
    </Box>
  );
}
