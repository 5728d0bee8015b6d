import { parseWorld } from '../../src/world/parse.js';
import type { World } from '../../src/world/types.js';

/** Emitter lines for the glyphs a test map may use. */
const EMITTERS: Readonly<Record<string, string>> = {
  E: '{ name: bell, glyph: E, on: floor, colour: [1, 0, 0], centre_hz: 1000, bandwidth_octaves: 8, level_db: 60 }',
  F: '{ name: gong, glyph: F, on: floor, colour: [1, 1, 0], centre_hz: 1000, bandwidth_octaves: 8, level_db: 60 }',
  o: '{ name: hum, glyph: o, on: floor, solid: false, colour: [0, 0, 1], centre_hz: 250, bandwidth_octaves: 1, level_db: 50 }',
  C: '{ name: clock, glyph: C, on: floor, colour: [0, 1, 0], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50, period_steps: 4, duty: 0.25 }',
};

/** Room physics a test may set; defaults make the ambient floor negligible (−20 dB). */
export interface TinyOptions {
  readonly cellSizeM?: number;
  readonly ambientDb?: number;
  readonly wallLossDb?: number;
}

/**
 * A hand-drawn world for tests: `#` wall, `.` floor, `,` rug; emitters `E` (bell, 1 kHz,
 * 8 octaves wide so every band is far above the floor),
 * `F` (gong, the same sound as the bell), `o` (a floor-level hum, not solid), `C` (a clock
 * on one step in four).
 */
export function tinyWorld(map: readonly string[], options: TinyOptions = {}): World {
  const glyphs = new Set(map.join(''));
  const text = [
    'name: tiny',
    `cell_size_m: ${options.cellSizeM ?? 1}`,
    `ambient_db: ${options.ambientDb ?? -20}`,
    `wall_loss_db: ${options.wallLossDb ?? 25}`,
    'materials:',
    '  - { name: wall, glyph: "#", solid: true, colour: [0.5, 0.5, 0.5] }',
    '  - { name: floor, glyph: ".", colour: [0.2, 0.4, 0.6], texture: [0.1, 0.2, 0.3, 0.4], footstep: { centre_hz: 2000, bandwidth_octaves: 1, level_db: 40 } }',
    '  - { name: rug, glyph: ",", colour: [0.8, 0.2, 0.2], texture: [0.9, 0, 0, 0] }',
    'emitters:',
    ...Object.keys(EMITTERS).filter((g) => glyphs.has(g)).map((g) => `  - ${EMITTERS[g]}`),
    'map: |',
    ...map.map((row) => `  ${row}`),
  ].join('\n');
  return parseWorld(text, 'tiny.yaml');
}
