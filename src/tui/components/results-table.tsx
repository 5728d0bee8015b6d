import { Box, Text } from 'ink';
import type { TableText } from '../dashboard/run-view.js';

const LABEL_WIDTH = 20;
const CELL_WIDTH = 10;

/** Probe scores, a row per learner and a column per severity, with a caption naming what is shown. */
export function ResultsTable({ table }: { readonly table: TableText }) {
  if (table.rows.length === 0) return <Text dimColor>no scores yet</Text>;
  return (
    <Box flexDirection="column">
      <Text wrap="truncate-end">{table.caption}</Text>
      <Box>
        <Box width={LABEL_WIDTH}><Text>learner</Text></Box>
        {table.columns.map((c) => <Box key={c} width={CELL_WIDTH}><Text>{c}</Text></Box>)}
      </Box>
      {table.rows.map((row) => (
        <Box key={row.label}>
          <Box width={LABEL_WIDTH} paddingRight={1}><Text wrap="truncate-end">{row.label}</Text></Box>
          {row.cells.map((cell, i) => <Box key={table.columns[i]} width={CELL_WIDTH}><Text>{cell}</Text></Box>)}
        </Box>
      ))}
    </Box>
  );
}
