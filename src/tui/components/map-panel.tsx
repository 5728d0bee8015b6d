import { Box, Text } from 'ink';

/** How a map cell stands out: the agent, a cell the agent sees, a sounding or silent emitter. */
export type MapMark = 'agent' | 'view' | 'sounding' | 'silent' | 'plain';

/** One map cell: its glyph and how it is marked. */
export interface MapCell {
  readonly glyph: string;
  readonly mark: MapMark;
}

/** Consecutive cells of one mark, drawn as one piece of text. */
function runs(row: readonly MapCell[]): { text: string; mark: MapMark }[] {
  const out: { text: string; mark: MapMark }[] = [];
  for (const cell of row) {
    const last = out[out.length - 1];
    if (last != null && last.mark === cell.mark) last.text += cell.glyph;
    else out.push({ text: cell.glyph, mark: cell.mark });
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
            <Text key={i} bold={run.mark === 'agent' || run.mark === 'sounding'} inverse={run.mark === 'view' || run.mark === 'agent'} dimColor={run.mark === 'silent'}>
              {run.text}
            </Text>
          ))}
        </Text>
      ))}
    </Box>
  );
}
