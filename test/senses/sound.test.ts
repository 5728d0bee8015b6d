import { describe, expect, it } from 'vitest';
import { ildDb } from '../../src/senses/acoustics.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { bandCentresHz } from '../../src/senses/mel.js';
import { senseAll } from '../../src/senses/sense-all.js';
import type { Heading, Pose, Transition } from '../../src/world/types.js';
import type { World } from '../../src/world/types.js';
import { tinyWorld } from '../world/fixtures.js';

const BANDS = 16;
const still = (pose: Pose): Transition => ({ pose, moved: false, bumped: false });

/** [left, right] band levels in dB heard at a pose. */
function hear(world: World, x: number, y: number, heading: Heading, transition?: Partial<Transition>, stepIndex = 0): [number[], number[]] {
  const pose = { x, y, heading };
  const sound = senseAll(world, pose, { ...still(pose), ...transition }, 'stay', stepIndex).sound;
  return [[...sound.subarray(0, BANDS)], [...sound.subarray(BANDS)]];
}

describe('sound levels against acoustics laws', () => {
  // A long corridor with the bell (E, 1 kHz, 60 dB at 1 m) at its north end; the agent faces it.
  const corridor = tinyWorld(['###', '#E#', '#.#', '#.#', '#.#', '#.#', '#.#', '#.#', '#.#', '#.#', '###']);

  it('drops 20·log10 2 = 6.02 dB in every band when the distance doubles (inverse-square law)', () => {
    const [near] = hear(corridor, 1, 3, 'north'); // 2 m from the bell
    const [far] = hear(corridor, 1, 5, 'north'); // 4 m
    for (let b = 0; b < BANDS; b++) expect(near[b] - far[b]).toBeCloseTo(6.0206, 3);
  });

  it('hears the bell at its 1 m level minus the distance loss in the band at 1 kHz', () => {
    // Levels at 2 m: 60 − 20·log10 2 = 53.98 dB at the centre frequency (spectrum shape 0 dB there).
    const hz = bandCentresHz(DEFAULT_SENSE_SETTINGS);
    const pose = { x: 1, y: 3, heading: 'north' as const };
    const expected = 60 - 20 * Math.log10(2) - 3 * (2 * Math.log2(hz[5] / 1000) / 8) ** 2;
    expect(hear(corridor, pose.x, pose.y, pose.heading)[0][5]).toBeCloseTo(expected, 3);
  });

  it('adds two equal incoherent sources to +10·log10 2 = 3.01 dB', () => {
    // Bell ahead and gong (same sound) behind, both 2 cells away: azimuths 0° and 180°, no level difference.
    const one = tinyWorld(['###', '#E#', '#.#', '#.#', '#.#', '#.#', '###']);
    const two = tinyWorld(['###', '#E#', '#.#', '#.#', '#.#', '#F#', '###']);
    const [single] = hear(one, 1, 3, 'north');
    const [both] = hear(two, 1, 3, 'north');
    for (let b = 0; b < BANDS; b++) expect(both[b] - single[b]).toBeCloseTo(10 * Math.log10(2), 3);
  });

  it('costs wall_loss_db for each solid cell strictly between source and listener', () => {
    const open = tinyWorld(['#####', '#E..#', '#...#', '#...#', '#####'], { wallLossDb: 10 });
    const oneWall = tinyWorld(['#####', '#E#.#', '#...#', '#...#', '#####'], { wallLossDb: 10 });
    const twoWalls = tinyWorld(['######', '#E##.#', '#....#', '######'], { wallLossDb: 10 });
    const twoOpen = tinyWorld(['######', '#E...#', '#....#', '######'], { wallLossDb: 10 });
    expect(hear(open, 3, 1, 'west')[0][5] - hear(oneWall, 3, 1, 'west')[0][5]).toBeCloseTo(10, 3);
    expect(hear(twoOpen, 4, 1, 'west')[0][5] - hear(twoWalls, 4, 1, 'west')[0][5]).toBeCloseTo(20, 3);
  });
});

describe('interaural level difference in the world (duplex theory, Rayleigh 1907)', () => {
  // The bell is 2 cells east of the agent.
  const room = tinyWorld(['#####', '#...#', '#..E#', '#...#', '#####']);
  const hz = bandCentresHz(DEFAULT_SENSE_SETTINGS);

  it('is louder in the right ear when the source is on the right, by ILD(f, 90°) in each band', () => {
    const [left, right] = hear(room, 1, 2, 'north');
    for (let b = 0; b < BANDS; b++) expect(right[b] - left[b]).toBeCloseTo(ildDb(hz[b], 90), 3);
  });

  it('swaps ears when the agent turns round', () => {
    const [left, right] = hear(room, 1, 2, 'south');
    expect(left[15] - right[15]).toBeCloseTo(ildDb(hz[15], 90), 3);
  });

  it('is zero facing the source', () => {
    const [left, right] = hear(room, 1, 2, 'east');
    expect(left).toEqual(right);
  });
});

describe('the agent\'s own sounds, the floor and duty cycles', () => {
  const room = tinyWorld(['#####', '#...#', '#.C.#', '#...#', '#####'], { ambientDb: 20 });

  it('hears only the ambient floor when every emitter is off and nothing moved', () => {
    const [left, right] = hear(room, 1, 1, 'east', {}, 1); // clock is off on step 1 of 4
    for (let b = 0; b < BANDS; b++) {
      expect(left[b]).toBeCloseTo(20, 4);
      expect(right[b]).toBeCloseTo(20, 4);
    }
  });

  it('hears the clock on its on-step, at its level less distance loss in the near (right) ear', () => {
    // Clock: 50 dB at 1 m, 3 kHz, 0.5 octave; √2 cells away at 45° to the right. Band 10 is at 3227 Hz.
    const hz = bandCentresHz(DEFAULT_SENSE_SETTINGS)[10];
    const expected = 50 - 20 * Math.log10(Math.SQRT2) - 3 * ((2 * Math.log2(hz / 3000)) / 0.5) ** 2;
    const [left, right] = hear(room, 1, 1, 'east', {}, 0);
    expect(right[10]).toBeCloseTo(10 * Math.log10(10 ** (expected / 10) + 10 ** 2), 3);
    expect(right[10] - left[10]).toBeGreaterThan(5);
  });

  it('hears footsteps only on a move, at the material\'s footstep level in its centre band', () => {
    const [still1] = hear(room, 1, 1, 'east', {}, 1);
    const [moved] = hear(room, 1, 1, 'east', { moved: true }, 1);
    // Footstep 40 dB centred at 2 kHz; band 8 is at 2157 Hz: 40 − 3·(2·log2(2157/2000))² dB, plus 20 dB ambient in power.
    const hz = bandCentresHz(DEFAULT_SENSE_SETTINGS)[8];
    const step = 40 - 3 * (2 * Math.log2(hz / 2000)) ** 2;
    expect(moved[8]).toBeCloseTo(10 * Math.log10(10 ** (step / 10) + 10 ** 2), 3);
    expect(still1[8]).toBeCloseTo(20, 4);
  });

  it('hears a low thud on a bump, loudest in the lowest band', () => {
    const [bumped] = hear(room, 1, 1, 'north', { bumped: true }, 1);
    expect(bumped[0]).toBeGreaterThan(55);
    expect(bumped[15]).toBeCloseTo(20, 3);
  });
});
