import { Box, Text } from 'ink';

/** A line of a text panel. */
export interface TextLine {
  readonly text: string;
  readonly bold?: boolean;
}

/** A bold title over lines of text, each cut at the panel's edge. */
export function TextPanel({ title, lines }: { readonly title: string; readonly lines: readonly TextLine[] }) {
  return (
    <Box flexDirection="column">
      <Text bold wrap="truncate-end">{title}</Text>
      {lines.map((line, i) => <Text key={i} bold={line.bold} wrap="truncate-end">{line.text}</Text>)}
    </Box>
  );
}
