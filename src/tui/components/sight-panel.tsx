import { Box, Text } from 'ink';

/** One sight cell as drawn: its text and, in colour mode, an ink colour such as `rgb(10,200,30)`. */
export interface SightBlock {
  readonly text: string;
  readonly color?: string;
}

/** The egocentric view, far row first, one block per sight cell. */
export function SightPanel({ title, rows }: { readonly title: string; readonly rows: readonly (readonly SightBlock[])[] }) {
  return (
    <Box flexDirection="column">
      <Text bold>{title}</Text>
      {rows.map((row, y) => (
        <Text key={y}>
          {row.map((block, x) => <Text key={x} color={block.color}>{block.text}</Text>)}
        </Text>
      ))}
    </Box>
  );
}
