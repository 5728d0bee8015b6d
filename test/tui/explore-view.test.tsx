import { renderToString } from 'ink';
import { describe, expect, it } from 'vitest';
import { ExploreScreen } from '../../src/tui/components/explore-screen.js';
import { initialExploreState, reduceExplore, type ExploreState } from '../../src/tui/explore/explore-state.js';
import { exploreView, type TerminalSize } from '../../src/tui/explore/explore-view.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { channelEntryNames } from '../../src/senses/registry.js';
import { loadWorld } from '../../src/world/parse.js';
import { BELL_AHEAD, bellRoom } from './worlds.js';

const start = (): ExploreState => initialExploreState([bellRoom(BELL_AHEAD)], 7, false);
const press = (state: ExploreState, ...keys: string[]) => keys.reduce(reduceExplore, state);
const screen = (state: ExploreState, size: TerminalSize) =>
  renderToString(<ExploreScreen view={exploreView(state, size)} />, { columns: size.columns }).split('\n');

describe('explore screen at 80×24', () => {
  it('fits 24 rows: facing east with the bell on the left, the left ear louder in every band above 100 Hz', () => {
    // Facing east after `d`, `t` waits to step 4, when the bell (period 4) rings again. The
    // left ear hears the bell at 2 m straight to the side; the right ear is shadowed more at
    // high frequency (52 dB left vs 33 dB right at 8 kHz). Bars span 20–80 dB in 5 dB halves:
    // 52 dB → (52 − 20) / 60 · 12 = 6.4 → 6 halves = three full cells; 33 dB → 2.6 → 3 halves.
    // The motor panel finds no room at this size and the footer says so.
    expect(screen(press(start(), 'd', 't', 'l'), { columns: 80, rows: 24 })).toEqual([
      'bell-room · step 4 · x 2 y 3 facing east · stay: stayed',
      '##########              sight · ahead is up           sound dB   left│right   dB',
      '##. EE. ##                                             100  52    ███│███     52',
      '##. . . ##                                             238  53   ▐███│███▌    53',
      '##. ◑ . ##              ░░░░░░░░▒▒▒▒                   400  54   ▐███│███     52',
      '##########              ░░░░▒▒▒▒▒▒▒▒▒▒▒▒               589  54   ▐███│███     51',
      '                                 ◓                     812  54   ▐███│███     49',
      '◓◑◒◐ you                touch                         1.1k  54   ▐███│██▌     47',
      'underlined: seen        whisker_left        0.00      1.4k  54   ▐███│██▌     45',
      '# wall  . boards        whisker_front       0.00      1.7k  54   ▐███│██      42',
      'E bell (on)             whisker_right █████ 1.00      2.2k  54   ▐███│██      40',
      'sound bars 20–80 dB     bump_force          0.00      2.6k  54   ▐███│██      39',
      '                        footfall_0          0.00      3.2k  53   ▐███│█▌      37',
      '                        footfall_1          0.00      3.9k  53   ▐███│█▌      36',
      '                        footfall_2          0.00      4.7k  53   ▐███│█▌      35',
      '                        footfall_3          0.00      5.6k  53   ▐███│█▌      34',
      '                        ground truth                  6.7k  53   ▐███│█▌      34',
      '                        x 2 y 3 east                  8.0k  52    ███│█▌      33',
      '                        under boards                  noise · n k + -',
      '                        ahead boards                  > sight gaussian 0 clean',
      '                        nearest bell                    sound gaussian 0 clean',
      '                        2.0 m at -90° (left)            touch gaussian 0 clean',
      '                        emitter in view no              motor gaussian 0 clean',
      '? keys · q quit · no room for: motor',
    ]);
  });
});

describe('explore screen at 120×40', () => {
  it('draws the map two characters per cell and keeps every panel, the ground truth beside the sight', () => {
    // One step forward (step 1): the bell is silent, every band at the 20 dB floor, the
    // footfall bars show the boards' texture 0.1 0.2 0.3 0.4, and the wall is ahead.
    expect(screen(press(start(), 'w', 'l'), { columns: 120, rows: 40 })).toEqual([
      'bell-room · step 1 · x 2 y 2 facing north · forward: moved',
      '##########                    sight · ahead is up         ground truth',
      '##. EE. ##                                                x 2 y 2 north',
      '##. ◓ . ##                                                under boards',
      '##. . . ##                    ░░░░░░░░    ░░░░░░░░        ahead boards wall',
      '##########                    ░░░░▒▒▒▒████▒▒▒▒░░░░        nearest bell',
      '                                       ◓                  1.0 m at 0° (ahead)',
      '◓◑◒◐ you  underlined: seen    sound dB   left│right   dB  emitter in view yes',
      '# wall  . boards               100  20       │        20  motor · last command',
      'E bell (off)                   238  20       │        20  forward       █████ 1.00',
      'sound bars 20–80 dB            400  20       │        20  back                0.00',
      '                               589  20       │        20  turn-left           0.00',
      '                               812  20       │        20  turn-right          0.00',
      '                              1.1k  20       │        20  stay                0.00',
      '                              1.4k  20       │        20',
      '                              1.7k  20       │        20',
      '                              2.2k  20       │        20',
      '                              2.6k  20       │        20',
      '                              3.2k  20       │        20',
      '                              3.9k  20       │        20',
      '                              4.7k  20       │        20',
      '                              5.6k  20       │        20',
      '                              6.7k  20       │        20',
      '                              8.0k  20       │        20',
      '                              touch',
      '                              whisker_left        0.00',
      '                              whisker_front █████ 1.00',
      '                              whisker_right       0.00',
      '                              bump_force          0.00',
      '                              footfall_0    ▌     0.10',
      '                              footfall_1    █     0.20',
      '                              footfall_2    █▌    0.30',
      '                              footfall_3    ██    0.40',
      '                              noise · n k + -',
      '                              > sight gaussian 0 clean',
      '                                sound gaussian 0 clean',
      '                                touch gaussian 0 clean',
      '                                motor gaussian 0 clean',
      '? keys · q quit',
    ]);
  });
});

describe('explore screen at any size', () => {
  const worlds = ['greenhouse', 'workshop', 'cave'].map((name) => loadWorld(`worlds/${name}.yaml`));
  const sizes: TerminalSize[] = [{ columns: 60, rows: 20 }, { columns: 80, rows: 24 }, { columns: 100, rows: 30 }, { columns: 120, rows: 40 }, { columns: 200, rows: 60 }];
  it.each(sizes)('never draws more rows than $rows or a line longer than $columns, with help and ground truth on', (size) => {
    for (let w = 0; w < worlds.length; w++) {
      const state = press(initialExploreState(worlds, 1, false), ...Array<string>(w).fill('g'), 'l', '?');
      const lines = screen(state, size);
      expect(lines.length).toBeLessThanOrEqual(size.rows);
      for (const line of lines) expect(line.length).toBeLessThanOrEqual(size.columns);
    }
  });
});

describe('explore view: the map', () => {
  it('draws the agent as a circle dark on its facing side, bold, and underlines the cells it sees', () => {
    const v = exploreView(start(), { columns: 80, rows: 24 });
    // 80×24 leaves the 5×5 room room for two characters per cell: solid cells doubled, open cells followed by a space.
    expect(v.map.map((row) => row.map((c) => c.text).join(''))).toEqual(['##########', '##. EE. ##', '##. . . ##', '##. ◓ . ##', '##########']);
    expect(v.map[3][2]).toEqual({ text: '◓ ', bold: true });
    // From (2, 3) facing north the agent sees rows y 0..2; the solid bell hides the wall behind it at (2, 0).
    const seen = v.map.map((row) => row.map((c) => (c.underline === true ? 'u' : '-')).join(''));
    expect(seen).toEqual(['uu-uu', 'uuuuu', 'uuuuu', '-----', '-----']);
  });

  it('draws a sounding emitter bold and a silent one dim', () => {
    expect(exploreView(start(), { columns: 80, rows: 24 }).map[1][2]).toMatchObject({ text: 'EE', bold: true, dim: false });
    expect(exploreView(press(start(), '.'), { columns: 80, rows: 24 }).map[1][2]).toMatchObject({ text: 'EE', bold: false, dim: true });
  });

  it('shows a window of a map wider than the terminal allows, centred on the agent but kept inside the map', () => {
    const wide = ['#'.repeat(60), `#${'.'.repeat(57)}E#`, ...Array<string>(2).fill(`#${'.'.repeat(58)}#`), '#'.repeat(60)];
    const at = (x: number) => initialExploreState([bellRoom(wide, `{ x: ${x}, y: 2, heading: east }`)], 1, false);
    // At 80 columns the panels take 54 (26 + 28 with gaps), leaving 26 map columns, one per cell.
    // Agent at x 50: the window would start at 50 − 13 = 37 but must end by column 59, so it starts at 34.
    const right = exploreView(at(50), { columns: 80, rows: 24 });
    expect(right.map[2].map((c) => c.text).join('')).toBe('................◑........#');
    expect(right.mapKey).toContain('x 34–59 y 0–4 of 60×5');
    // Agent at x 3: the window starts at column 0.
    expect(exploreView(at(3), { columns: 80, rows: 24 }).map[2].map((c) => c.text).join('')).toBe('#..◑......................');
  });
});

describe('explore view: panels', () => {
  it('labels the touch bars with the channel registry names that sense --json and worlds/README.md use', () => {
    const touch = exploreView(start(), { columns: 120, rows: 40 }).columns.flatMap((c) => c.panels).find((p) => p.kind === 'bars' && p.title === 'touch');
    expect(touch?.kind === 'bars' && touch.bars.map((b) => b.label)).toEqual([...channelEntryNames('touch', DEFAULT_SENSE_SETTINGS)]);
  });

  it('names the kind, severity and parameter of each channel and marks the one the keys change', () => {
    const v = exploreView(press(start(), '+', '+', '+', 'n', 'k', 'k', 'k', '+'), { columns: 120, rows: 40 });
    const noise = v.columns.flatMap((c) => c.panels).find((p) => p.kind === 'text' && p.title.startsWith('noise'));
    expect(noise).toEqual({ kind: 'text', title: 'noise · n k + -', lines: [
      { text: '  sight gaussian 3 σ 1', bold: false },
      { text: '> sound masking 1 SNR 20dB', bold: true },
      { text: '  touch gaussian 0 clean', bold: false },
      { text: '  motor gaussian 0 clean', bold: false },
    ] });
  });

  it('uses no colour and only shade characters for sight in monochrome mode', () => {
    const v = exploreView(start(), { columns: 120, rows: 40 });
    const sight = v.columns.flatMap((c) => c.panels).find((p) => p.kind === 'sight');
    expect(sight?.kind === 'sight' && sight.rows.flat().every((b) => b.color == null && /^[ ░▒▓█]{4}$/.test(b.text))).toBe(true);
    expect(v.map.flat().every((c) => c.color == null)).toBe(true);
  });

  it('splits a sound panel with more bands than rows into parts side by side', () => {
    const state = initialExploreState([bellRoom(BELL_AHEAD)], 7, false, { sight: { width: 5, depth: 4 }, sound: { bands: 40, minHz: 100, maxHz: 8000 } });
    const panels = exploreView(state, { columns: 200, rows: 30 }).columns.flatMap((c) => c.panels);
    // 30 rows less the status and footer leave 28: a part is a header and 27 bands, so 40 bands make 27 + 13.
    const sound = panels.filter((p) => p.kind === 'text' && p.title.startsWith('sound'));
    expect(sound.map((p) => (p.kind === 'text' ? p.lines.length : 0))).toEqual([27, 13]);
  });
});
