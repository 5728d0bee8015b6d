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

describe('world file errors: each names path:line:col, the key (list items by 0-based index and name) and a reason', () => {
  it('accepts the base world', () => {
    expect(problemsOf(BASE.join('\n'))).toEqual([]);
  });

  it('reports an unknown glyph at its map cell', () => {
    const [p] = problemsOf(variant(11, '  #.XC#'));
    expect(p).toBe('w.yaml:11:5: map: unknown glyph "X" at x=2, y=1: not a material or emitter glyph');
  });

  it('reports a ragged row at the start of the row', () => {
    const [p] = problemsOf(variant(11, '  #..C.#'));
    expect(p).toBe('w.yaml:11:3: map: ragged: row 1 has 6 cells but row 0 has 5');
  });

  it('reports a map with no free cell', () => {
    const text = variant(11, '  #####').replace('  #####\n  #####\n  #####', '  ####C\n  #####\n  #####');
    const problems = problemsOf(text.replace('on: boards', 'on: boards, solid: true'));
    expect(problems.some((p) => p.startsWith('w.yaml:9:6: map: no free cell'))).toBe(true);
  });

  it('reports an open border at the first open edge cell', () => {
    const [p] = problemsOf(variant(11, '  ...C#'));
    expect(p).toBe('w.yaml:11:3: map: open border at x=0, y=1: the edge cell is not solid, so the agent could walk off the map');
  });

  it('reports a duplicate glyph at the second use', () => {
    const [p] = problemsOf(variant(5, '  - { name: boards, glyph: "#", colour: [0.7, 0.5, 0.3] }'));
    expect(p).toBe("w.yaml:5:28: materials.1 (boards).glyph: duplicate glyph '#': already used by materials.0 (wall) at w.yaml:4:26");
  });

  it('reports a duplicate name at the second use', () => {
    const [p] = problemsOf(variant(7, '  - { name: boards, glyph: C, on: boards, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50 }'));
    expect(p).toBe("w.yaml:7:13: emitters.0 (boards).name: duplicate name 'boards': already used by materials.1 (boards) at w.yaml:5:13");
  });

  it('reports a colour entry out of range', () => {
    const [p] = problemsOf(variant(4, '  - { name: wall, glyph: "#", solid: true, colour: [0.4, 1.3, 0.2] }'));
    expect(p).toBe("w.yaml:4:58: materials.0 (wall).colour.1: expected a number >= 0 and <= 1, got 1.3");
  });

  it('reports a texture entry out of range', () => {
    const [p] = problemsOf(variant(5, '  - { name: boards, glyph: ".", colour: [0.7, 0.5, 0.3], texture: [0.2, -1, 0.1, 0] }'));
    expect(p).toBe("w.yaml:5:73: materials.1 (boards).texture.1: expected a number >= 0 and <= 1, got -1");
  });

  it('reports a texture of the wrong length', () => {
    const [p] = problemsOf(variant(5, '  - { name: boards, glyph: ".", colour: [0.7, 0.5, 0.3], texture: [0.2] }'));
    expect(p).toBe("w.yaml:5:67: materials.1 (boards).texture: expected a list of 4 numbers, got 1 item");
  });

  it('reports an emitter on a solid material', () => {
    const [p] = problemsOf(variant(7, '  - { name: clock, glyph: C, on: wall, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50 }'));
    expect(p).toBe("w.yaml:7:34: emitters.0 (clock).on: material 'wall' is solid; an emitter stands on a floor");
  });

  it('reports an emitter on an unknown material with the nearest name', () => {
    const [p] = problemsOf(variant(7, '  - { name: clock, glyph: C, on: bords, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwidth_octaves: 0.5, level_db: 50 }'));
    expect(p).toBe("w.yaml:7:34: emitters.0 (clock).on: unknown material 'bords' (did you mean 'boards'?)");
  });

  it('reports a map over 256×256 cells', () => {
    const wide = `  #${'.'.repeat(256)}C#`;
    const border = `  ${'#'.repeat(259)}`;
    const text = [...BASE.slice(0, 9), border, wide, border].join('\n');
    const [p] = problemsOf(text);
    expect(p).toBe('w.yaml:9:6: map: 259×3 cells; the largest allowed is 256×256');
  });

  it('reports a start on a solid cell', () => {
    const [p] = problemsOf(variant(8, 'start: { x: 0, y: 1, heading: east }'));
    expect(p).toBe('w.yaml:8:8: start: x=0, y=1 is on a solid cell');
  });

  it('reports a start outside the map', () => {
    const [p] = problemsOf(variant(8, 'start: { x: 9, y: 1, heading: east }'));
    expect(p).toBe('w.yaml:8:8: start: x=9, y=1 is outside the 5×3 map');
  });

  it('reports an unknown top-level key with the nearest valid key, and the required key it leaves missing', () => {
    expect(problemsOf(variant(2, 'cell_size: 0.5'))).toEqual([
      'w.yaml:1:1: cell_size_m: required, missing from the world',
      "w.yaml:2:1: cell_size: unknown key (did you mean 'cell_size_m'?); expected one of name, description, cell_size_m, ambient_db, wall_loss_db, materials, emitters, start, map",
    ]);
  });

  it('reports an unknown key inside an emitter with the nearest valid key', () => {
    expect(problemsOf(variant(7, '  - { name: clock, glyph: C, on: boards, colour: [0.8, 0.1, 0.1], centre_hz: 3000, bandwith_octaves: 0.5, level_db: 50 }'))).toEqual([
      'w.yaml:7:5: emitters.0 (clock).bandwidth_octaves: required, missing from emitters.0 (clock)',
      "w.yaml:7:84: emitters.0 (clock).bandwith_octaves: unknown key (did you mean 'bandwidth_octaves'?); expected one of name, glyph, on, solid, colour, centre_hz, bandwidth_octaves, level_db, period_steps, duty",
    ]);
  });

  it('reports an emitter glyph placed twice at the second place', () => {
    const [p] = problemsOf(variant(11, '  #.CC#'));
    expect(p).toBe("w.yaml:11:6: map: emitter 'clock' (glyph 'C') appears again at x=3, y=1; it was already placed at w.yaml:11:5, and each emitter is one source");
  });

  it('reports an emitter glyph missing from the map at the emitter glyph', () => {
    const [p] = problemsOf(variant(11, '  #...#'));
    expect(p).toBe("w.yaml:7:27: emitters.0 (clock).glyph: 'C' does not appear in the map; each emitter is placed once");
  });

  it('reports a YAML alias, which world files do not read, at the alias', () => {
    const text = variant(5, '  - { name: boards, glyph: ".", colour: *c }').replace('colour: [0.4, 0.3, 0.2]', 'colour: &c [0.4, 0.3, 0.2]');
    const [p] = problemsOf(text);
    expect(p).toBe("w.yaml:5:41: materials.1 (boards).colour: a YAML alias; world files do not read aliases, so write the value out");
  });

  it('reports a key with no value', () => {
    expect(problemsOf(variant(2, 'cell_size_m:'))).toEqual(['w.yaml:2:1: cell_size_m: has no value']);
  });

  it('reports YAML syntax errors with their position', () => {
    const [p] = problemsOf(variant(2, 'cell_size_m: [0.5'));
    expect(p).toMatch(/^w\.yaml:\d+:\d+: YAML syntax: /);
  });

  it('reports a run of open border cells as one line', () => {
    const text = BASE.join('\n').replace('  #####\n  #..C#', '  #...#\n  #..C#');
    expect(problemsOf(text)).toEqual(['w.yaml:10:4: map: open border at x=1..3, y=0: the edge cells are not solid, so the agent could walk off the map']);
  });

  it('reports a run of one unknown glyph in a row as one line', () => {
    expect(problemsOf(variant(11, '  #XXC#'))).toEqual(['w.yaml:11:4: map: unknown glyph "X" at x=1..2, y=1: not a material or emitter glyph']);
  });

  it('a misspelt key does not hide an emitter on an unknown material, nor a map problem', () => {
    const text = variant(5, '  - { name: boards, glyph: ".", colour: [0.7, 0.5, 0.3], textur: [0.2, 0.3, 0.1, 0] }')
      .replace('on: boards', 'on: bords').replace('  #..C#', '  #.XC#');
    expect(problemsOf(text)).toEqual([
      "w.yaml:5:58: materials.1 (boards).textur: unknown key (did you mean 'texture'?); expected one of name, glyph, solid, colour, texture, footstep",
      "w.yaml:7:34: emitters.0 (clock).on: unknown material 'bords' (did you mean 'boards'?)",
      'w.yaml:11:5: map: unknown glyph "X" at x=2, y=1: not a material or emitter glyph',
    ]);
  });

  it('reports a key written twice at its second place', () => {
    expect(problemsOf(variant(2, 'cell_size_m: 0.5\ncell_size_m: 1'))).toEqual([
      'w.yaml:3:1: cell_size_m: the key is written twice (first at line 2, column 1); keep one',
    ]);
  });

  it('collects every problem, and parseWorld throws them all as one message', () => {
    const text = variant(2, 'cell_size_m: -1').replace('colour: [0.4, 0.3, 0.2]', 'colour: [0.4, 0.3, 2]');
    const problems = problemsOf(text);
    expect(problems).toHaveLength(2);
    expect(() => parseWorld(text, 'w.yaml')).toThrow(WorldFileError);
    expect(() => parseWorld(text, 'w.yaml')).toThrow(problems.join('\n'));
  });

  it('shows numbers that are not finite as written, not as null', () => {
    expect(problemsOf(variant(2, 'cell_size_m: .nan'))).toEqual(['w.yaml:2:14: cell_size_m: expected a number > 0 and <= 100, got .nan (not a finite number)']);
    expect(problemsOf(variant(2, 'cell_size_m: .inf'))).toEqual(['w.yaml:2:14: cell_size_m: expected a number > 0 and <= 100, got .inf (not a finite number)']);
    // 1e400 is beyond the largest double (about 1.8e308, IEEE 754 binary64), so it reads as infinity.
    expect(problemsOf(variant(2, 'cell_size_m: 1e400'))).toEqual(['w.yaml:2:14: cell_size_m: expected a number > 0 and <= 100, got 1e400 (not a finite number)']);
  });

  it('takes any single-width character as a glyph and says plainly that wide ones are refused', () => {
    const glyph = (g: string) => problemsOf(variant(5, `  - { name: boards, glyph: "${g}", colour: [0.7, 0.5, 0.3] }`).replace('#..C#', `#${g}${g}C#`));
    expect(glyph('░')).toEqual([]); // U+2591 LIGHT SHADE: East Asian Width "A", one column in Western terminals
    expect(glyph('é')).toEqual([]);
    const refused = (g: string) => `w.yaml:5:28: materials.1 (boards).glyph: expected one single-width visible character (emoji and other wide characters are not allowed), got "${g}"`;
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
