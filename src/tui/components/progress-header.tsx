import { Box, Text } from 'ink';
import type { ProgressText } from '../dashboard/run-view.js';

/** The sweep's name, cell counts, timing and the latest note. */
export function ProgressHeader({ progress }: { readonly progress: ProgressText }) {
  return (
    <Box flexDirection="column">
      <Text bold wrap="truncate-middle">{progress.title}</Text>
      <Text>{progress.counts}</Text>
      <Text>{progress.timing}</Text>
      {progress.notes.map((note) => <Text key={note} wrap="truncate-end">{note}</Text>)}
    </Box>
  );
}
