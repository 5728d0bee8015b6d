import { Box, Text } from 'ink';

/** One map cell as drawn: its text (one or two characters) and how it stands out. */
export interface MapCell {
  readonly text: string;
  /** An ink colour for the text; absent without colour. */
  readonly color?: string;
  readonly bold?: boolean;
  readonly dim?: boolean;
  readonly underline?: boolean;
}

type Style = Omit<MapCell, 'text'>;

const sameStyle = (a: Style, b: Style) => a.color === b.color && a.bold === b.bold && a.dim === b.dim && a.underline === b.underline;

/** Consecutive cells of one style, drawn as one piece of text. */
function runs(row: readonly MapCell[]): MapCell[] {
  const out: MapCell[] = [];
  for (const cell of row) {
    const last = out[out.length - 1];
    if (last != null && sameStyle(last, cell)) out[out.length - 1] = { ...last, text: last.text + cell.text };
    else out.push(cell);
  }
  return out;
}

/** The world map; its marks are text attributes (bold, dim, underline), so they survive a terminal without colour. */
export function MapPanel({ rows }: { readonly rows: readonly (readonly MapCell[])[] }) {
  return (
    <Box flexDirection="column">
      {rows.map((row, y) => (
        <Text key={y} wrap="truncate-end">
          {runs(row).map((run, i) => (
            <Text key={i} color={run.color} bold={run.bold} dimColor={run.dim} underline={run.underline}>{run.text}</Text>
          ))}
        </Text>
      ))}
    </Box>
  );
}
