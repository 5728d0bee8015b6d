import { Box, Text } from 'ink';
import type { WorkerText } from '../dashboard/run-view.js';

/** One line per running worker: its cell, epoch, latest loss and loss trend; a spiking learner's firing below. */
export function WorkerList({ workers }: { readonly workers: readonly WorkerText[] }) {
  if (workers.length === 0) return <Text dimColor>no cell running</Text>;
  return (
    <Box flexDirection="column">
      {workers.map((w) => (
        <Box key={w.worker} flexDirection="column">
          <Box>
            <Box width={10} flexShrink={0}><Text>{w.worker}</Text></Box>
            <Box width={37} flexShrink={0} marginRight={1}><Text wrap="truncate-end">{w.cell}</Text></Box>
            <Box width={9} flexShrink={0}><Text>{w.epoch}</Text></Box>
            <Box width={12} flexShrink={0}><Text>{w.loss}</Text></Box>
            <Text wrap="truncate-end">{w.trend}</Text>
          </Box>
          {w.firing === '' ? null : <Box marginLeft={10}><Text wrap="truncate-end">{w.firing}</Text></Box>}
        </Box>
      ))}
    </Box>
  );
}
