import { parseWorld } from '../../src/world/parse.js';
import type { World } from '../../src/world/types.js';

/** A hand-drawn world for tests: `#` wall, `.` floor, `E` a solid emitter, `o` a floor emitter. */
export function tinyWorld(map: readonly string[], extra: Partial<{ cellSizeM: number; ambientDb: number; wallLossDb: number }> = {}): World {
  const glyphs = new Set(map.join(''));
  const emitters = [
    glyphs.has('E') ? '  - { name: bell, glyph: E, on: floor, colour: [1, 0, 0], centre_hz: 1000, bandwidth_octaves: 1, level_db: 60 }' : '',
    glyphs.has('o') ? '  - { name: hum, glyph: o, on: floor, solid: false, colour: [0, 0, 1], centre_hz: 250, bandwidth_octaves: 1, level_db: 50 }' : '',
  ].filter((l) => l !== '');
  const text = [
    'name: tiny',
    `cell_size_m: ${extra.cellSizeM ?? 1}`,
    `ambient_db: ${extra.ambientDb ?? -20}`,
    `wall_loss_db: ${extra.wallLossDb ?? 25}`,
    'materials:',
    '  - { name: wall, glyph: "#", solid: true, colour: [0.5, 0.5, 0.5] }',
    '  - { name: floor, glyph: ".", colour: [0.2, 0.4, 0.6], texture: [0.1, 0.2, 0.3, 0.4], footstep: { centre_hz: 2000, bandwidth_octaves: 1, level_db: 40 } }',
    '  - { name: rug, glyph: ",", colour: [0.8, 0.2, 0.2], texture: [0.9, 0, 0, 0] }',
    'emitters:',
    ...emitters,
    'map: |',
    ...map.map((row) => `  ${row}`),
  ].join('\n');
  return parseWorld(text, 'tiny.yaml');
}
