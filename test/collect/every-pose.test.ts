import { describe, expect, it } from 'vitest';
import { everyPoseSample } from '../../src/collect/every-pose.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { senseAll } from '../../src/senses/sense-all.js';
import { step } from '../../src/world/movement.js';
import { parseWorld } from '../../src/world/parse.js';

// A test room: 5 free floor cells and one emitter cell inside a wall.
const ROOM = parseWorld(`name: closet
cell_size_m: 0.5
materials:
  - { name: wall, glyph: "#", solid: true, colour: [0.5, 0.5, 0.5] }
  - { name: floor, glyph: ".", colour: [0.6, 0.6, 0.6], texture: [0.1, 0.0, 0.0, 0.0] }
emitters:
  - { name: radio, glyph: R, on: floor, colour: [0.2, 0.2, 0.2], centre_hz: 1000, bandwidth_octaves: 1.0, level_db: 50, period_steps: 2, duty: 0.5 }
map: |
  #####
  #..R#
  #...#
  #####
`, 'closet.yaml');

describe('everyPoseSample', () => {
  it('has one row per free cell and heading (5 cells × 4 headings)', () => {
    const sample = everyPoseSample(ROOM, DEFAULT_SENSE_SETTINGS);
    expect(sample.rows).toBe(20);
    expect(sample.channels.motor.length).toBe(20 * 5);
  });

  it('holds, row by row, what senseAll gives one step forward from that pose at clock = row', () => {
    const sample = everyPoseSample(ROOM, DEFAULT_SENSE_SETTINGS);
    // Row 5 is the second free cell in reading order, (2, 1), facing east (headings north, east, south, west).
    const transition = step(ROOM, { x: 2, y: 1, heading: 'east' }, 'forward');
    const expected = senseAll(ROOM, transition.pose, transition, 'forward', 5, DEFAULT_SENSE_SETTINGS);
    const size = expected.sound.length;
    expect(Array.from(sample.channels.sound.subarray(5 * size, 6 * size))).toEqual(Array.from(expected.sound));
  });
});
