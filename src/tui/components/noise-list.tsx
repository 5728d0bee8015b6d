import { Box, Text } from 'ink';

/** The noise setting of each channel, the one the keys change marked with `>`. */
export function NoiseList({ noise }: { readonly noise: readonly { readonly text: string; readonly selected: boolean }[] }) {
  return (
    <Box flexDirection="column">
      <Text bold>noise · keys n k + -</Text>
      {noise.map((n) => <Text key={n.text} bold={n.selected}>{`${n.selected ? '>' : ' '} ${n.text}`}</Text>)}
    </Box>
  );
}
