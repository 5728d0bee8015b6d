import { Box, Text } from 'ink';

/** One sight cell as drawn: its text and, in colour mode, an ink colour such as `rgb(10,200,30)`. */
export interface SightBlock {
  readonly text: string;
  readonly color?: string;
}

/** The egocentric view, far row first, one block per sight cell, with the agent's place below it. */
export function SightPanel({ title, rows, agent }: {
  readonly title: string;
  readonly rows: readonly (readonly SightBlock[])[];
  readonly agent: string;
}) {
  return (
    <Box flexDirection="column">
      <Text bold wrap="truncate-end">{title}</Text>
      {rows.map((row, y) => (
        <Text key={y}>
          {row.map((block, x) => <Text key={x} color={block.color}>{block.text}</Text>)}
        </Text>
      ))}
      <Text bold>{agent}</Text>
    </Box>
  );
}
