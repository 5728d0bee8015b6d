import { render } from 'ink-testing-library';
import { describe, expect, it } from 'vitest';
import { SoundPanel } from '../../src/tui/components/sound-panel.js';
import { initialExploreState, reduceExplore, type ExploreState } from '../../src/tui/explore/explore-state.js';
import { exploreView } from '../../src/tui/explore/explore-view.js';
import { noisySenses } from '../../src/tui/explore/noisy-senses.js';
import { BELL_AHEAD, bellRoom } from './worlds.js';

const start = (): ExploreState => initialExploreState([bellRoom(BELL_AHEAD)], 7, true);
const press = (state: ExploreState, ...keys: string[]) => keys.reduce(reduceExplore, state);

/** 16 band centres equally spaced in mel from 100 Hz to 8 kHz, mel = 2595·log10(1 + f/700) (O'Shaughnessy 1987). */
const BANDS_HZ = Array.from({ length: 16 }, (_, b) => {
  const mel = (f: number) => 2595 * Math.log10(1 + f / 700);
  const m = mel(100) + ((mel(8000) - mel(100)) * b) / 15;
  return 700 * (10 ** (m / 2595) - 1);
});

/**
 * The bell heard at distance dM by the near ear, plus the 20 dB floor, in dB: 60 dB at 1 m,
 * −20·log10(d) (inverse-square law), a spectrum −3·(2·log2(f/1 kHz)/8)² dB (half power at
 * ±4 octaves, the bell's 8-octave bandwidth), the far ear lower by the head shadow
 * 20·|sin az|·r/(1 + r), r = (f / 1500 Hz)² (the world module's documented ILD model), and
 * sources adding in power.
 */
function expectedDb(hz: number, dM: number, shadowSin: number): number {
  const shape = -3 * ((2 * Math.log2(hz / 1000)) / 8) ** 2;
  const r = (hz / 1500) ** 2;
  const bell = 60 - 20 * Math.log10(dM) + shape - 20 * shadowSin * (r / (1 + r));
  return 10 * Math.log10(10 ** (20 / 10) + 10 ** (bell / 10));
}

const lines = (node: React.ReactElement) => {
  const app = render(node);
  const out = (app.lastFrame() ?? '').split('\n');
  app.unmount();
  return out;
};

describe('explore view: sound', () => {
  it('hears the bell 2 m straight ahead equally in both ears at the level the laws give', () => {
    const { sound } = exploreView(start());
    BANDS_HZ.forEach((hz, b) => {
      expect(sound.leftDb[b]).toBeCloseTo(expectedDb(hz, 2, 0), 2);
      expect(sound.rightDb[b]).toBeCloseTo(expectedDb(hz, 2, 0), 2);
    });
  });

  it('shadows the right ear when the bell is on the left (facing east), more at high frequency', () => {
    const { sound } = exploreView(press(start(), 'd', 't'));
    BANDS_HZ.forEach((hz, b) => {
      expect(sound.leftDb[b]).toBeCloseTo(expectedDb(hz, 2, 0), 2);
      expect(sound.rightDb[b]).toBeCloseTo(expectedDb(hz, 2, 1), 2);
    });
  });

  it('draws that pose as two spectra on a 20–80 dB scale', () => {
    // Two rows per ear = 16 eighths over 60 dB. Top band, 8 kHz: near ear 52.3 dB →
    // (52.3 − 20) / 60 · 16 = 8.6 → 9 eighths (a full lower cell, ▁ above); far ear
    // 52.3 − 19.3 = 33.0 dB, 33.2 dB with the floor added in power → 3.5 → 4 eighths (▄).
    // Lowest band, 100 Hz: 51.9 dB near, 51.8 dB far → 8.5 → 9 and 8 eighths.
    expect(lines(<SoundPanel {...exploreView(press(start(), 'd', 't')).sound} />)).toEqual([
      'sound · dB 20–80 per column · Hz',
      '  ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁ ▁▁',
      'L ██ ██ ██ ██ ██ ██ ██ ██ ██ ██ ██ ██ ██ ██ ██ ██',
      '     ▁▁ ▁▁',
      'R ██ ██ ██ ██ ██ ▇▇ ▇▇ ▆▆ ▅▅ ▅▅ ▅▅ ▄▄ ▄▄ ▄▄ ▄▄ ▄▄',
      '  100   400   812   1.4k  2.2k  3.2k  4.7k  6.7k',
      '     238   589   1.1k  1.7k  2.6k  3.9k  5.6k  8.0k',
    ]);
  });

  it('falls to the 20 dB floor in every band while the bell is silent (step 1)', () => {
    const { sound } = exploreView(press(start(), '.'));
    for (const db of [...sound.leftDb, ...sound.rightDb]) expect(db).toBeCloseTo(20, 6);
  });
});

describe('explore view: noise', () => {
  it('leaves every channel clean at severity 0', () => {
    const s = start();
    const a = noisySenses(s);
    const b = noisySenses(press(s, 'k'));
    for (const c of ['sight', 'sound', 'touch', 'motor'] as const) expect(b[c]).toEqual(a[c]);
  });

  it('corrupts only the chosen channel, the same way on every redraw of one state', () => {
    const clean = noisySenses(start());
    const s = press(start(), '+', '+', '+');
    const noisy = noisySenses(s);
    expect(noisy.sight).not.toEqual(clean.sight);
    expect(noisy.sight).toEqual(noisySenses(s).sight);
    for (const c of ['sound', 'touch', 'motor'] as const) expect(noisy[c]).toEqual(clean[c]);
  });

  it('names the kind, severity and parameter of each channel', () => {
    expect(exploreView(press(start(), '+', '+', '+', 'n', 'k', 'k', 'k', '+')).noise).toEqual([
      { text: 'sight gaussian 3 σ 1', selected: false },
      { text: 'sound masking 1 SNR 20dB', selected: true },
      { text: 'touch gaussian 0 clean', selected: false },
      { text: 'motor gaussian 0 clean', selected: false },
    ]);
  });
});

describe('explore view: map and text', () => {
  it('marks the agent with its heading, the bell as sounding, and reports the pose', () => {
    const v = exploreView(start());
    expect(v.map.map((row) => row.map((c) => c.glyph).join(''))).toEqual(['#####', '#.E.#', '#...#', '#.^.#', '#####']);
    expect(v.map[1][2].mark).toBe('sounding');
    expect(v.map[2][2].mark).toBe('view');
    expect(v.status).toBe('bell-room · step 0 · x 2 y 3 facing north · stay: stayed');
    expect(v.legend).toEqual(['^>v< you · reverse: in view', 'E bell sounding']);
  });

  it('shows the bell as silent once the clock moves on', () => {
    expect(exploreView(press(start(), 'a')).map[1][2].mark).toBe('silent');
  });

  it('shows the ground truth on demand', () => {
    expect(exploreView(start()).truth).toBeNull();
    expect(exploreView(press(start(), 'l')).truth).toEqual([
      'ground truth',
      'x 2 y 3 north',
      'under boards',
      'ahead boards',
      'nearest bell 2.0 m at 0°',
      'emitter in view yes',
      'moved no bumped no',
    ]);
  });

  it('uses no colour and only shade characters for sight in monochrome mode', () => {
    const v = exploreView(press(start(), 'c'));
    for (const block of v.sight.rows.flat()) {
      expect(block.color).toBeUndefined();
      expect(block.text).toMatch(/^[ ░▒▓█]{4}$/);
    }
    expect(v.map.flat().every((c) => c.color == null)).toBe(true);
  });
});
