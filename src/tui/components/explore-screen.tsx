import { Box, Text } from 'ink';
import { COLUMN_GAP } from '../explore/layout.js';
import type { ExploreView, PanelView } from '../explore/explore-view.js';
import { BAR_LABEL_WIDTH, BAR_WIDTH } from '../explore/explore-view.js';
import { BarList } from './bar-list.js';
import { MapPanel } from './map-panel.js';
import { SightPanel } from './sight-panel.js';
import { TextPanel } from './text-panel.js';

function Panel({ panel }: { readonly panel: PanelView }) {
  switch (panel.kind) {
    case 'sight': return <SightPanel title={panel.title} rows={panel.rows} agent={panel.agent} />;
    case 'bars': return <BarList title={panel.title} bars={panel.bars} labelWidth={BAR_LABEL_WIDTH} barWidth={BAR_WIDTH} />;
    case 'text': return <TextPanel title={panel.title} lines={panel.lines} />;
  }
}

/** The whole explore screen: status, map and its key, columns of panels, and the keys. */
export function ExploreScreen({ view }: { readonly view: ExploreView }) {
  return (
    <Box flexDirection="column">
      <Text wrap="truncate-end">{view.status}</Text>
      {view.replay != null ? <Text wrap="truncate-end">{view.replay}</Text> : null}
      <Box gap={COLUMN_GAP}>
        {view.mapWidth > 0 ? (
          <Box flexDirection="column" width={view.mapWidth} flexShrink={0}>
            <MapPanel rows={view.map} />
            {view.mapKey.length > 0 ? (
              <Box flexDirection="column" marginTop={1}>{view.mapKey.map((line, i) => <Text key={i} wrap="truncate-end">{line}</Text>)}</Box>
            ) : null}
          </Box>
        ) : null}
        {view.columns.map((column, i) => (
          <Box key={i} flexDirection="column" width={column.width} flexShrink={0}>
            {column.panels.map((panel, j) => <Panel key={j} panel={panel} />)}
          </Box>
        ))}
      </Box>
      {view.footer.map((line, i) => <Text key={i} dimColor wrap="truncate-end">{line}</Text>)}
    </Box>
  );
}
