import { describe, expect, it } from 'vitest';
import { checkWorldText, parseWorld } from '../../src/world/parse.js';
import { WorldFileError } from '../../src/world/problems.js';

// A valid tiny world; each test changes one line and expects one exact problem position.
// Line numbers below count from 1 at `name:`.
const BASE = [
  'name: shed',                                                             // 1
  'cell_size_m: 0.5',                                                       // 2
  'materials:',                                                             // 3
  '  - { name: wall, glyph: "#", solid: true, colour: [0.4, 0.3, 0.2] }',  // 4
  '  - { name: boards, glyph: ".", colour: [0.7, 0.5, 0.3], texture: [0.2, 0.3, 0.1, 0] }', // 5
  'emitters:',                                                              // 6
  '  - { name: clock, glyph: C, on: boards, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50 }', // 7
  'start: { x: 1, y: 1, heading: east }',                                  // 8
  'map: |',                                                                 // 9
  '  #####',                                                                // 10
  '  #..C#',                                                                // 11
  '  #####',                                                                // 12
];

function variant(line: number, text: string): string {
  return BASE.map((l, i) => (i + 1 === line ? text : l)).join('\n') + '\n';
}

function problemsOf(text: string): string[] {
  return checkWorldText(text, 'w.yaml');
}

describe('world file errors: each names path:line:col and a reason', () => {
  it('accepts the base world', () => {
    expect(problemsOf(BASE.join('\n'))).toEqual([]);
  });

  it('reports an unknown glyph at its map cell', () => {
    const [p] = problemsOf(variant(11, '  #.XC#'));
    expect(p).toMatch(/^w\.yaml:11:5: unknown glyph "X"/);
  });

  it('reports a ragged row at the start of the row', () => {
    const [p] = problemsOf(variant(11, '  #..C.#'));
    expect(p).toBe('w.yaml:11:3: ragged map: row 1 has 6 cells but row 0 has 5');
  });

  it('reports a map with no free cell', () => {
    const text = variant(11, '  #####').replace('  #####\n  #####\n  #####', '  ####C\n  #####\n  #####');
    const problems = problemsOf(text.replace('on: boards', 'on: boards, solid: true'));
    expect(problems.some((p) => p.startsWith('w.yaml:9:6: the map has no free cell'))).toBe(true);
  });

  it('reports an open border at the first open edge cell', () => {
    const [p] = problemsOf(variant(11, '  ...C#'));
    expect(p).toBe('w.yaml:11:3: open border at x=0, y=1: the edge cell is not solid, so the agent could walk off the map');
  });

  it('reports a duplicate glyph at the second use', () => {
    const [p] = problemsOf(variant(5, '  - { name: boards, glyph: "#", colour: [0.7, 0.5, 0.3] }'));
    expect(p).toBe("w.yaml:5:28: duplicate glyph '#': already used by material 'wall' at w.yaml:4:26");
  });

  it('reports a duplicate name at the second use', () => {
    const [p] = problemsOf(variant(7, '  - { name: boards, glyph: C, on: boards, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50 }'));
    expect(p).toBe("w.yaml:7:13: duplicate name 'boards': already used by the material at w.yaml:5:13");
  });

  it('reports a colour entry out of range', () => {
    const [p] = problemsOf(variant(4, '  - { name: wall, glyph: "#", solid: true, colour: [0.4, 1.3, 0.2] }'));
    expect(p).toBe("w.yaml:4:58: 'colour'[1] in material 1 must be a number >= 0 and <= 1, got 1.3");
  });

  it('reports a texture entry out of range', () => {
    const [p] = problemsOf(variant(5, '  - { name: boards, glyph: ".", colour: [0.7, 0.5, 0.3], texture: [0.2, -1, 0.1, 0] }'));
    expect(p).toBe("w.yaml:5:73: 'texture'[1] in material 2 must be a number >= 0 and <= 1, got -1");
  });

  it('reports a texture of the wrong length', () => {
    const [p] = problemsOf(variant(5, '  - { name: boards, glyph: ".", colour: [0.7, 0.5, 0.3], texture: [0.2] }'));
    expect(p).toBe("w.yaml:5:67: 'texture' in material 2 must be a list of 4 numbers");
  });

  it('reports an emitter on a solid material', () => {
    const [p] = problemsOf(variant(7, '  - { name: clock, glyph: C, on: wall, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50 }'));
    expect(p).toBe("w.yaml:7:34: emitter 'clock' is on solid material 'wall'; it must stand on a floor");
  });

  it('reports an emitter on an unknown material with the nearest name', () => {
    const [p] = problemsOf(variant(7, '  - { name: clock, glyph: C, on: bords, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50 }'));
    expect(p).toBe("w.yaml:7:34: emitter 'clock' is on unknown material 'bords'; did you mean 'boards'?");
  });

  it('reports a map over 256×256 cells', () => {
    const wide = `  #${'.'.repeat(256)}C#`;
    const border = `  ${'#'.repeat(259)}`;
    const text = [...BASE.slice(0, 9), border, wide, border].join('\n');
    const [p] = problemsOf(text);
    expect(p).toBe('w.yaml:9:6: map is 259×3 cells; the largest allowed is 256×256');
  });

  it('reports a start on a solid cell', () => {
    const [p] = problemsOf(variant(8, 'start: { x: 0, y: 1, heading: east }'));
    expect(p).toBe('w.yaml:8:8: start x=0, y=1 is on a solid cell');
  });

  it('reports a start outside the map', () => {
    const [p] = problemsOf(variant(8, 'start: { x: 9, y: 1, heading: east }'));
    expect(p).toBe('w.yaml:8:8: start x=9, y=1 is outside the 5×3 map');
  });

  it('reports an unknown top-level key with the nearest valid key', () => {
    const [p] = problemsOf(variant(2, 'cell_size: 0.5'));
    expect(p).toBe("w.yaml:2:1: unknown key 'cell_size' in the world; did you mean 'cell_size_m'?");
  });

  it('reports an unknown key inside an emitter with the nearest valid key', () => {
    const [p] = problemsOf(variant(7, '  - { name: clock, glyph: C, on: boards, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwith_octaves: 0.5, level_db: 50 }'));
    expect(p).toBe("w.yaml:7:84: unknown key 'bandwith_octaves' in emitter 1; did you mean 'bandwidth_octaves'?");
  });

  it('reports an emitter glyph placed twice at the second place', () => {
    const [p] = problemsOf(variant(11, '  #.CC#'));
    expect(p).toBe("w.yaml:11:6: emitter 'clock' (glyph 'C') appears again at x=3, y=1; it was already placed at w.yaml:11:5, and each emitter is one source");
  });

  it('reports an emitter glyph missing from the map at the emitter glyph', () => {
    const [p] = problemsOf(variant(11, '  #...#'));
    expect(p).toBe("w.yaml:7:27: emitter 'clock' (glyph 'C') does not appear in the map");
  });

  it('reports a YAML alias, which world files do not read, at the alias', () => {
    const text = variant(5, '  - { name: boards, glyph: ".", colour: *c }').replace('colour: [0.4, 0.3, 0.2]', 'colour: &c [0.4, 0.3, 0.2]');
    const [p] = problemsOf(text);
    expect(p).toBe("w.yaml:5:41: 'colour' in material 2 is a YAML alias; world files do not read aliases, so write the value out");
  });

  it('reports a key with no value', () => {
    expect(problemsOf(variant(2, 'cell_size_m:'))).toEqual(["w.yaml:2:1: 'cell_size_m' in the world has no value"]);
  });

  it('reports YAML syntax errors with their position', () => {
    const [p] = problemsOf(variant(2, 'cell_size_m: [0.5'));
    expect(p).toMatch(/^w\.yaml:\d+:\d+: YAML syntax: /);
  });

  it('collects every problem, and parseWorld throws them all as one message', () => {
    const text = variant(2, 'cell_size_m: -1').replace('colour: [0.4, 0.3, 0.2]', 'colour: [0.4, 0.3, 2]');
    const problems = problemsOf(text);
    expect(problems).toHaveLength(2);
    expect(() => parseWorld(text, 'w.yaml')).toThrow(WorldFileError);
    expect(() => parseWorld(text, 'w.yaml')).toThrow(problems.join('\n'));
  });

  it('shows numbers that are not finite as written, not as null', () => {
    expect(problemsOf(variant(2, 'cell_size_m: .nan'))).toEqual(["w.yaml:2:14: 'cell_size_m' in the world must be a number > 0 and <= 100, got .nan (not a finite number)"]);
    expect(problemsOf(variant(2, 'cell_size_m: .inf'))).toEqual(["w.yaml:2:14: 'cell_size_m' in the world must be a number > 0 and <= 100, got .inf (not a finite number)"]);
    // 1e400 is beyond the largest double (about 1.8e308, IEEE 754 binary64), so it reads as infinity.
    expect(problemsOf(variant(2, 'cell_size_m: 1e400'))).toEqual(["w.yaml:2:14: 'cell_size_m' in the world must be a number > 0 and <= 100, got 1e400 (not a finite number)"]);
  });

  it('takes any single-width character as a glyph and says plainly that wide ones are refused', () => {
    const glyph = (g: string) => problemsOf(variant(5, `  - { name: boards, glyph: "${g}", colour: [0.7, 0.5, 0.3] }`).replace('#..C#', `#${g}${g}C#`));
    expect(glyph('░')).toEqual([]); // U+2591 LIGHT SHADE: East Asian Width "A", one column in Western terminals
    expect(glyph('é')).toEqual([]);
    const refused = (g: string) => `w.yaml:5:28: 'glyph' in material 2 must be one single-width visible character (emoji and other wide characters are not allowed), got "${g}"`;
    expect(glyph('🌱')).toEqual([refused('🌱')]); // U+1F331, an emoji: two UTF-16 units, two columns
    expect(glyph('⌚')).toEqual([refused('⌚')]); // U+231A, one UTF-16 unit but Emoji_Presentation, two columns
    expect(glyph('木')).toEqual([refused('木')]); // U+6728, a CJK ideograph: East Asian Width "W"
  });

  it('refuses YAML nested deeper than the limit with one located line, before parsing it', () => {
    const deep = variant(2, `cell_size_m: ${'['.repeat(100_000)}${']'.repeat(100_000)}`);
    // The top-level mapping is level 1, so the 64th bracket (column 13 + 64) opens level 65.
    expect(problemsOf(deep)).toEqual(['w.yaml:2:77: nested more than 64 levels deep (see "Limits" in the README)']);
  });
});
