import { Box, Text } from 'ink';
import { horizontalBar } from '../format.js';

/** One labelled quantity: its share of the bar's full length and its value as text. */
export interface LabelledBar {
  readonly label: string;
  readonly fraction: number;
  readonly value: string;
}

/** A titled list of labelled horizontal bars (touch, motor). */
export function BarList({ title, bars, labelWidth, barWidth }: {
  readonly title: string;
  readonly bars: readonly LabelledBar[];
  readonly labelWidth: number;
  readonly barWidth: number;
}) {
  return (
    <Box flexDirection="column">
      <Text bold>{title}</Text>
      {bars.map((bar) => (
        <Text key={bar.label}>
          {bar.label.padEnd(labelWidth)} {horizontalBar(bar.fraction, barWidth)} {bar.value}
        </Text>
      ))}
    </Box>
  );
}
