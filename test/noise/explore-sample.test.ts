import { describe, expect, it } from 'vitest';
import { exploreSample, type ExploreStep } from '../../src/noise/explore-sample.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS, type ChannelName } from '../../src/senses/channel.js';
import { step as move } from '../../src/world/movement.js';
import type { Action } from '../../src/world/types.js';
import { BELL_AHEAD, bellRoom } from '../tui/worlds.js';

const world = bellRoom(BELL_AHEAD);
const clean = Object.fromEntries(CHANNELS.map((c) => [c, { kind: 'gaussian', severity: 0 }])) as ExploreStep['noise'];

/** The step after `action` from the bell room's start (2, 3) facing north, at clock `stepIndex`. */
function stepAt(action: Action, stepIndex: number, noise: Partial<ExploreStep['noise']> = {}, heading: 'north' | 'east' = 'north'): ExploreStep {
  const transition = move(world, { x: 2, y: 3, heading }, action);
  return {
    world, worldIndex: 0, settings: DEFAULT_SENSE_SETTINGS, seed: 7,
    pose: transition.pose, transition, action, stepIndex, noise: { ...clean, ...noise },
  };
}

/** 16 band centres equally spaced in mel from 100 Hz to 8 kHz, mel = 2595·log10(1 + f/700) (O'Shaughnessy 1987). */
const BANDS_HZ = Array.from({ length: 16 }, (_, b) => {
  const mel = (f: number) => 2595 * Math.log10(1 + f / 700);
  const m = mel(100) + ((mel(8000) - mel(100)) * b) / 15;
  return 700 * (10 ** (m / 2595) - 1);
});

/**
 * The bell heard at distance dM, plus the 20 dB floor, in dB: 60 dB at 1 m, −20·log10(d)
 * (inverse-square law), a spectrum −3·(2·log2(f/1 kHz)/8)² dB (half power at ±4 octaves,
 * the bell's 8-octave bandwidth), the far ear lower by the head shadow
 * 20·|sin az|·r/(1 + r), r = (f / 1500 Hz)² (the world module's documented ILD model), and
 * sources adding in power.
 */
function expectedDb(hz: number, dM: number, shadowSin: number): number {
  const shape = -3 * ((2 * Math.log2(hz / 1000)) / 8) ** 2;
  const r = (hz / 1500) ** 2;
  const bell = 60 - 20 * Math.log10(dM) + shape - 20 * shadowSin * (r / (1 + r));
  return 10 * Math.log10(10 ** (20 / 10) + 10 ** (bell / 10));
}

describe('exploreSample: what the screen is given', () => {
  it('hears the bell 2 m straight ahead equally in both ears at the level the laws give', () => {
    const { senses, bandsHz } = exploreSample(stepAt('stay', 0));
    BANDS_HZ.forEach((hz, b) => {
      expect(bandsHz[b]).toBeCloseTo(hz, 6);
      expect(senses.sound[b]).toBeCloseTo(expectedDb(hz, 2, 0), 2);
      expect(senses.sound[16 + b]).toBeCloseTo(expectedDb(hz, 2, 0), 2);
    });
  });

  it('shadows the right ear when the bell is on the left (facing east), more at high frequency', () => {
    const { senses } = exploreSample(stepAt('stay', 4, {}, 'east'));
    BANDS_HZ.forEach((hz, b) => {
      expect(senses.sound[b]).toBeCloseTo(expectedDb(hz, 2, 0), 2);
      expect(senses.sound[16 + b]).toBeCloseTo(expectedDb(hz, 2, 1), 2);
    });
  });

  it('reports the bell sounding at step 0 and silent at step 1 (period 4, duty 0.25)', () => {
    expect(exploreSample(stepAt('stay', 0)).sounding).toEqual([true]);
    expect(exploreSample(stepAt('stay', 1)).sounding).toEqual([false]);
  });

  it('lists the cells the agent sees from (2, 3) facing north: rows y 2, 1, 0 of x 0..4, less the wall behind the bell', () => {
    // The field is 5 wide × 4 deep: columns x 0..4, rows y 2, 1, 0 and −1 (off the map). The
    // bell at (2, 1) is solid (emitters are unless `solid: false`), so it hides (2, 0) = cell 2.
    const cells = [...exploreSample(stepAt('stay', 0)).cellsInView].sort((a, b) => a - b);
    expect(cells).toEqual([0, 1, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14]);
  });

  it('leaves every channel clean at severity 0, whatever the kind', () => {
    const a = exploreSample(stepAt('forward', 1)).senses;
    const b = exploreSample(stepAt('forward', 1, { sight: { kind: 'dropout', severity: 0 } })).senses;
    for (const c of CHANNELS) expect(b[c]).toEqual(a[c]);
  });

  it('corrupts only the chosen channel, the same way each time the step is drawn', () => {
    const noisy = { sight: { kind: 'gaussian' as const, severity: 3 } };
    const a = exploreSample(stepAt('forward', 1)).senses;
    const b = exploreSample(stepAt('forward', 1, noisy));
    expect(b.senses.sight).not.toEqual(a.sight);
    expect(b.senses.sight).toEqual(exploreSample(stepAt('forward', 1, noisy)).senses.sight);
    for (const c of ['sound', 'touch', 'motor'] as ChannelName[]) expect(b.senses[c]).toEqual(a[c]);
    // Severity 3 of gaussian is σ = 1 training std (the severity table in src/noise/severity.ts).
    expect(b.noiseParameter.sight).toBe(1);
  });

  it('silences a blacked-out channel to its silence level: sight goes dark', () => {
    // Blackout severity 5 silences a row with p = 0.9; seed 7 at this step draws a blackout.
    const { senses } = exploreSample(stepAt('forward', 1, { sight: { kind: 'blackout', severity: 5 } }));
    expect([...senses.sight].every((v) => v === 0)).toBe(true);
  });
});
