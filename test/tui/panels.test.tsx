import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { BarList } from '../../src/tui/components/bar-list.js';
import { HelpLine } from '../../src/tui/components/help-line.js';
import { MapPanel } from '../../src/tui/components/map-panel.js';
import { SightPanel } from '../../src/tui/components/sight-panel.js';
import { TextPanel } from '../../src/tui/components/text-panel.js';
import { ResultsTable } from '../../src/tui/components/results-table.js';

const lines = (node: React.ReactElement) => {
  const app = render(node);
  const out = (app.lastFrame() ?? '').split('\n');
  app.unmount();
  return out;
};

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
  it('draws the given blocks row by row under its title, then the agent line', () => {
    expect(lines(<SightPanel title="sight" rows={[[{ text: '░░' }, { text: '▓▓' }], [{ text: '██' }, { text: '  ' }]]} agent="  ◓" />)).toEqual([
      'sight',
      '░░▓▓',
      '██',
      '  ◓',
    ]);
  });
});

describe('MapPanel', () => {
  it('shows every cell\'s text in place whatever its attributes', () => {
    const row = [{ text: '##' }, { text: '◑ ', bold: true }, { text: '. ', underline: true }, { text: 'F ', bold: true, underline: true }, { text: 'W ', dim: true }];
    expect(lines(<MapPanel rows={[row, row]} />)).toEqual(['##◑ . F W', '##◑ . F W']);
  });
});

describe('TextPanel', () => {
  it('draws its title and lines as given', () => {
    expect(lines(<TextPanel title="noise" lines={[{ text: '> sight clean', bold: true }, { text: '  sound clean' }]} />)).toEqual([
      'noise',
      '> sight clean',
      '  sound clean',
    ]);
  });
});

describe('HelpLine', () => {
  it('lists key and action pairs separated by two spaces', () => {
    expect(lines(<HelpLine keys={[['q', 'quit'], ['?', 'help']]} />)).toEqual(['q quit  ? help']);
  });
});

describe('ResultsTable', () => {
  it('cuts a long learner name with an ellipsis and keeps a space before the first score', () => {
    const table = { caption: 'wall_ahead (accuracy)', columns: ['sev 0'], rows: [{ label: 'touch-from-sight-and-motor', cells: ['0.99±0.01'] }] };
    const { lastFrame } = render(<ResultsTable table={table} />);
    expect(lastFrame()!.split('\n')[2]).toBe('touch-from-sight-a… 0.99±0.01');
  });
});
