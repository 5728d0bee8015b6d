import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { BarList } from '../../src/tui/components/bar-list.js';
import { HelpLine } from '../../src/tui/components/help-line.js';
import { EXPLORE_KEYS } from '../../src/tui/explore/explore-state.js';
import { MapPanel } from '../../src/tui/components/map-panel.js';
import { SightPanel } from '../../src/tui/components/sight-panel.js';
import { SoundPanel } from '../../src/tui/components/sound-panel.js';
import { ResultsTable } from '../../src/tui/components/results-table.js';

const lines = (node: React.ReactElement) => {
  const app = render(node);
  const out = (app.lastFrame() ?? '').split('\n');
  app.unmount();
  return out;
};

describe('SoundPanel', () => {
  it('draws one column per band per ear, scaled between floor and ceiling, labels staggered under the columns', () => {
    // 40 dB range over 2 rows = 16 eighths, so 2.5 dB per eighth: 20 dB → 0, 30 → 4 eighths,
    // 40 → 8, 45 → 10 (a full lower cell and a quarter upper cell), 60 → 16; 10 dB clamps to empty.
    expect(lines(
      <SoundPanel title="sound" bandLabels={['100', '250', '1.0k', '8k']} leftDb={[20, 30, 40, 60]} rightDb={[60, 45, 20, 10]} floorDb={20} ceilingDb={60} height={2} />,
    )).toEqual([
      'sound',
      '           ██',
      'L    ▄▄ ██ ██',
      '  ██ ▂▂',
      'R ██ ██',
      '  100   1.0k',
      '     250   8k',
    ]);
  });
});

describe('BarList', () => {
  it('draws a labelled bar of eighth blocks per quantity with its value', () => {
    expect(lines(
      <BarList title="touch" labelWidth={8} barWidth={4} bars={[
        { label: 'bump', fraction: 0, value: '0.00' },
        { label: 'whisker', fraction: 0.5, value: '0.50' },
        { label: 'foot 1', fraction: 0.3, value: '0.30' },
      ]} />,
    )).toEqual([
      'touch',
      'bump          0.00',
      'whisker  ██   0.50',
      // 0.3 × 4 cells × 8 = 9.6 → 10 eighths: one full block and a quarter block.
      'foot 1   █▎   0.30',
    ]);
  });
});

describe('SightPanel', () => {
  it('draws the given blocks row by row under its title', () => {
    expect(lines(<SightPanel title="sight" rows={[[{ text: '░░' }, { text: '▓▓' }], [{ text: '██' }, { text: '  ' }]]} />)).toEqual([
      'sight',
      '░░▓▓',
      '██',
    ]);
  });
});

describe('MapPanel', () => {
  it('shows every glyph in place whatever its mark', () => {
    const row = [{ glyph: '#', mark: 'plain' as const }, { glyph: '>', mark: 'agent' as const }, { glyph: '.', mark: 'view' as const }, { glyph: 'F', mark: 'sounding' as const }];
    expect(lines(<MapPanel rows={[row, row]} />)).toEqual(['#>.F', '#>.F']);
  });
});

describe('HelpLine', () => {
  it('lists key and action pairs separated by two spaces', () => {
    expect(lines(<HelpLine keys={[['q', 'quit'], ['?', 'help']]} />)).toEqual(['q quit  ? help']);
  });

  it('fits the explore keys on one line of an 80-column terminal', () => {
    const help = lines(<HelpLine keys={EXPLORE_KEYS} />);
    expect(help).toEqual(['↑↓←→ wasd move  . stay  t tick  n k +- noise  g world  c colour  l truth  q quit']);
    expect(help[0].length).toBeLessThanOrEqual(80);
  });
});

describe('ResultsTable', () => {
  it('cuts a long learner name with an ellipsis and keeps a space before the first score', () => {
    const table = { caption: 'wall_ahead (accuracy)', columns: ['sev 0'], rows: [{ label: 'touch-from-sight-and-motor', cells: ['0.99±0.01'] }] };
    const { lastFrame } = render(<ResultsTable table={table} />);
    expect(lastFrame()!.split('\n')[2]).toBe('touch-from-sight-a… 0.99±0.01');
  });
});
