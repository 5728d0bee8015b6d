import { parseWorld } from '../../src/world/parse.js';
import type { World } from '../../src/world/types.js';

/**
 * A hand-made world for the explorer's tests: 1 m cells, a 20 dB floor, one grey wall
 * material, a floor with a four-entry texture, and a bell `E` (60 dB at 1 m, 1 kHz,
 * 8 octaves wide) that rings on one step in four (period 4, duty 0.25).
 */
export function bellRoom(map: readonly string[], start = '{ x: 2, y: 3, heading: north }'): World {
  return parseWorld([
    'name: bell-room',
    'description: a test room',
    'cell_size_m: 1',
    'ambient_db: 20',
    'wall_loss_db: 20',
    'materials:',
    '  - { name: wall, glyph: "#", solid: true, colour: [0.5, 0.5, 0.5] }',
    '  - { name: boards, glyph: ".", colour: [0.4, 0.3, 0.2], texture: [0.1, 0.2, 0.3, 0.4] }',
    'emitters:',
    '  - { name: bell, glyph: E, on: boards, colour: [1, 0.8, 0], centre_hz: 1000, bandwidth_octaves: 8, level_db: 60, period_steps: 4, duty: 0.25 }',
    `start: ${start}`,
    'map: |',
    ...map.map((row) => `  ${row}`),
  ].join('\n'), 'bell-room.yaml');
}

/** The bell two cells north of the start (2, 3), in a 5×5 room. */
export const BELL_AHEAD = ['#####', '#.E.#', '#...#', '#...#', '#####'];

/** A second room for world switching: a steady hum `H`, start in a corner facing east. */
export function plainRoom(): World {
  return parseWorld([
    'name: plain-room',
    'description: a second test room',
    'cell_size_m: 1',
    'materials:',
    '  - { name: wall, glyph: "#", solid: true, colour: [0.5, 0.5, 0.5] }',
    '  - { name: boards, glyph: ".", colour: [0.4, 0.3, 0.2], texture: [0.1, 0.2, 0.3, 0.4] }',
    'emitters:',
    '  - { name: hum, glyph: H, on: boards, colour: [0, 0, 1], centre_hz: 250, bandwidth_octaves: 1, level_db: 50 }',
    'start: { x: 1, y: 1, heading: east }',
    'map: |',
    '  #####',
    '  #..H#',
    '  #####',
  ].join('\n'), 'plain-room.yaml');
}
