import { Box, Text } from 'ink';
import { verticalBarCell } from '../format.js';

/** Both ears' band levels, already in dB, with the band labels and the drawn dB range. */
export interface SoundPanelProps {
  readonly title: string;
  /** Band centre labels, low to high. */
  readonly bandLabels: readonly string[];
  readonly leftDb: readonly number[];
  readonly rightDb: readonly number[];
  /** Level drawn as an empty column. */
  readonly floorDb: number;
  /** Level drawn as a full column. */
  readonly ceilingDb: number;
  /** Text rows per ear. */
  readonly height: number;
}

const SLOT = 3; // characters per band: a two-wide column and a gap

function earRows(name: string, levelsDb: readonly number[], p: SoundPanelProps): string[] {
  const fractions = levelsDb.map((db) => (db - p.floorDb) / (p.ceilingDb - p.floorDb));
  const rows: string[] = [];
  for (let row = p.height - 1; row >= 0; row--) {
    const prefix = row === 0 ? `${name} ` : '  ';
    rows.push(prefix + fractions.map((f) => verticalBarCell(f, row, p.height).repeat(SLOT - 1)).join(' '));
  }
  return rows;
}

/** Labels of alternate bands on two staggered lines, so each band's label sits under its column. */
function labelRows(labels: readonly string[]): [string, string] {
  const lines = ['  ', '  '];
  labels.forEach((label, i) => {
    const line = i % 2;
    lines[line] = lines[line].padEnd(2 + i * SLOT) + label;
  });
  return [lines[0], lines[1]];
}

/** Left- and right-ear spectra as columns, one per band, with the band frequencies labelled. */
export function SoundPanel(props: SoundPanelProps) {
  const [even, odd] = labelRows(props.bandLabels);
  return (
    <Box flexDirection="column">
      <Text bold>{props.title}</Text>
      {[...earRows('L', props.leftDb, props), ...earRows('R', props.rightDb, props), even, odd].map((line, i) => (
        <Text key={i}>{line}</Text>
      ))}
    </Box>
  );
}
