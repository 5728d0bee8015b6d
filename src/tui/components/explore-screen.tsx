import { Box, Text } from 'ink';
import { EXPLORE_KEYS } from '../explore/explore-state.js';
import type { ExploreView } from '../explore/explore-view.js';
import { BarList } from './bar-list.js';
import { HelpLine } from './help-line.js';
import { MapPanel } from './map-panel.js';
import { NoiseList } from './noise-list.js';
import { SightPanel } from './sight-panel.js';
import { SoundPanel } from './sound-panel.js';


/** The whole explore screen: status, map, every sense, noise settings and keys. */
export function ExploreScreen({ view }: { readonly view: ExploreView }) {
  return (
    <Box flexDirection="column">
      <Text wrap="truncate-end">{view.status}</Text>
      <Box gap={2}>
        <Box flexShrink={0}><MapPanel rows={view.map} /></Box>
        <Box flexDirection="column" flexShrink={0}>
          <SightPanel title={view.sight.title} rows={view.sight.rows} />
          <BarList title="touch" bars={view.touch} labelWidth={10} barWidth={8} />
        </Box>
        <Box flexDirection="column" flexShrink={0}>
          <NoiseList noise={view.noise} />
          <BarList title="motor · last command" bars={view.motor} labelWidth={10} barWidth={8} />
          {view.legend.map((line) => <Text key={line}>{line}</Text>)}
        </Box>
      </Box>
      <Box gap={2}>
        <Box flexShrink={0}><SoundPanel {...view.sound} /></Box>
        {view.truth == null ? null : (
          <Box flexDirection="column" flexShrink={0}>{view.truth.map((line) => <Text key={line}>{line}</Text>)}</Box>
        )}
      </Box>
      {view.help ? <HelpLine keys={EXPLORE_KEYS} /> : <Text dimColor>? keys · q quit</Text>}
    </Box>
  );
}
