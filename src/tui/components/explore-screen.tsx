import { Box, Text } from 'ink';
import type { ExploreView } from '../explore/explore-view.js';
import { BarList } from './bar-list.js';
import { HelpLine } from './help-line.js';
import { MapPanel } from './map-panel.js';
import { SightPanel } from './sight-panel.js';
import { SoundPanel } from './sound-panel.js';

/** The explore keys, as the help line lists them. */
export const EXPLORE_KEYS: readonly (readonly [string, string])[] = [
  ['↑↓←→/wasd', 'move'], ['.', 'stay'], ['t', 'clock'], ['n k + -', 'noise'],
  ['g', 'world'], ['c', 'colour'], ['l', 'truth'], ['?', 'help'], ['q', 'quit'],
];

function NoiseList({ noise }: { readonly noise: ExploreView['noise'] }) {
  return (
    <Box flexDirection="column">
      <Text bold>noise · n channel k kind +- level</Text>
      {noise.map((n) => <Text key={n.text} bold={n.selected}>{`${n.selected ? '>' : ' '} ${n.text}`}</Text>)}
    </Box>
  );
}

/** The whole explore screen: status, map, every sense, noise settings and keys. */
export function ExploreScreen({ view }: { readonly view: ExploreView }) {
  return (
    <Box flexDirection="column">
      <Text wrap="truncate-end">{view.status}</Text>
      <Box gap={2}>
        <MapPanel rows={view.map} />
        <Box flexDirection="column">
          <SightPanel title={view.sight.title} rows={view.sight.rows} />
          <BarList title="touch" bars={view.touch} labelWidth={13} barWidth={8} />
        </Box>
        <Box flexDirection="column">
          <NoiseList noise={view.noise} />
          <BarList title="motor · last command" bars={view.motor} labelWidth={10} barWidth={8} />
          {view.legend.map((line) => <Text key={line}>{line}</Text>)}
        </Box>
      </Box>
      <Box gap={2}>
        <SoundPanel {...view.sound} />
        {view.truth == null ? null : (
          <Box flexDirection="column">{view.truth.map((line) => <Text key={line}>{line}</Text>)}</Box>
        )}
      </Box>
      {view.help ? <HelpLine keys={EXPLORE_KEYS} /> : <Text dimColor>? keys · q quit</Text>}
    </Box>
  );
}
