import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { senseCommand } from '../../src/commands/sense.js';
import { checkConfigFile } from '../../src/experiment/config.js';

// A closet: the agent at (2,1) facing east has just stepped forward from (1,1); a buzzer
// (solid, blue) stands one cell ahead at (3,1). Every expected value below is worked by hand.
const CLOSET = `name: closet
cell_size_m: 1
ambient_db: 0
wall_loss_db: 20
materials:
  - { name: wall, glyph: "#", solid: true, colour: [0.5, 0.5, 0.5] }
  - { name: tile, glyph: ".", colour: [1, 0, 0], texture: [0.1, 0.2, 0.3, 0.4],
      footstep: { centre_hz: 1000, bandwidth_octaves: 2, level_db: 40 } }
emitters:
  - { name: buzzer, glyph: Z, on: tile, colour: [0, 0, 1], centre_hz: 1000, bandwidth_octaves: 1, level_db: 60 }
map: |
  #####
  #..Z#
  #####
`;

let dir: string;
let out: string[];
let err: string[];

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'crosswise-sense-'));
  writeFileSync(join(dir, 'closet.yaml'), CLOSET);
  out = [];
  err = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => { out.push(line); });
  vi.spyOn(console, 'error').mockImplementation((line: string) => { err.push(line); });
});

afterEach(() => vi.restoreAllMocks());

async function senseJson(...args: string[]) {
  expect(await senseCommand([join(dir, 'closet.yaml'), ...args, '--json'])).toBe(0);
  return JSON.parse(out.join('\n'));
}

describe('crosswise sense --json on a hand-made closet', () => {
  it('reports the pose, action and a [4, 5, 3] sight field', async () => {
    const r = await senseJson('--at', '2,1,east', '--action', 'forward');
    expect(r.pose).toEqual({ x: 2, y: 1, heading: 'east' });
    expect(r.action).toBe('forward');
    expect(r.sight.shape).toEqual([4, 5, 3]);
  });

  it('sees walls at 1/(1²+1²) = 0.5 of their colour diagonally, the buzzer at full colour ahead, nothing past it', async () => {
    const r = await senseJson('--at', '2,1,east', '--action', 'forward');
    // Row 0 is x = 3: columns are y = -1 (off map), 0 (wall), 1 (buzzer), 2 (wall), 3 (off map).
    expect(r.sight.values[0]).toEqual([[0, 0, 0], [0.25, 0.25, 0.25], [0, 0, 1], [0.25, 0.25, 0.25], [0, 0, 0]]);
    // Row 1 (x = 4) lies behind the wall and buzzer column; rows 2-3 are off the map.
    for (const row of r.sight.values.slice(1)) expect(row.flat()).toEqual(new Array(15).fill(0));
  });

  it('hears the buzzer 1 m ahead plus its own footsteps and the 0 dB floor, equal in both ears', async () => {
    const r = await senseJson('--at', '2,1,east', '--action', 'forward');
    // Band 5 centre from the mel formula (O'Shaughnessy 1987), 16 bands from 100 Hz to 8 kHz.
    const mel = (f: number) => 2595 * Math.log10(1 + f / 700);
    const m5 = mel(100) + (5 * (mel(8000) - mel(100))) / 15;
    const f5 = 700 * (10 ** (m5 / 2595) - 1);
    expect(r.sound.bands_hz[5]).toBeCloseTo(f5, 1);
    const octaves = Math.log2(f5 / 1000);
    const buzzer = 60 - 3 * (2 * octaves / 1) ** 2; // 0 dB distance loss at 1 m
    const footstep = 40 - 3 * (2 * octaves / 2) ** 2;
    const total = 10 * Math.log10(10 ** (buzzer / 10) + 10 ** (footstep / 10) + 1);
    expect(r.sound.left_db[5]).toBeCloseTo(total, 3);
    expect(r.sound.right_db).toEqual(r.sound.left_db);
  });

  it('feels walls on both sides and the buzzer ahead, and the tile texture after the step', async () => {
    const r = await senseJson('--at', '2,1,east', '--action', 'forward');
    expect(r.touch.names).toEqual(['whisker_left', 'whisker_front', 'whisker_right', 'bump_force', 'footfall_0', 'footfall_1', 'footfall_2', 'footfall_3']);
    expect(r.touch.values).toEqual([1, 1, 1, 0, 0.1, 0.2, 0.3, 0.4]);
    expect(r.motor).toEqual({ units: 'one-hot action', names: ['forward', 'back', 'turn-left', 'turn-right', 'stay'], values: [1, 0, 0, 0, 0] });
  });

  it('names the unit of every channel', async () => {
    const r = await senseJson('--at', '2,1,east');
    expect([r.sight.units, r.sound.units, r.touch.units, r.motor.units]).toEqual([
      'colour reflectance × lamp illumination (0..1)',
      'dB re the world reference level, per band',
      'whisker contact 0/1, bump force in full-speed bumps, footfall vibration 0..1',
      'one-hot action',
    ]);
  });

  it('reports the latents by name', async () => {
    const r = await senseJson('--at', '2,1,east', '--action', 'forward');
    expect(r.latents).toEqual({
      x: 2, y: 1, heading: 'east', material_under: 'tile', material_ahead: 'tile', wall_ahead: true,
      nearest_emitter: 'buzzer', nearest_distance_m: 1, nearest_azimuth_deg: 0, emitter_in_view: true,
      moved: true, bumped: false,
    });
  });

  it('treats forward with walls both ahead and behind as a bump', async () => {
    const r = await senseJson('--at', '1,1,north', '--action', 'forward');
    expect(r.latents.bumped).toBe(true);
    expect(r.touch.values[3]).toBe(1);
  });
});

describe('crosswise sense --config', () => {
  it("uses the config's world and sense sizes: 24 bands and a 3 × 2 view", async () => {
    writeFileSync(join(dir, 'c.yaml'), [
      'name: wide-ears', 'world: closet.yaml',
      'senses: { sight: { width: 3, depth: 2 }, sound: { bands: 24, min_hz: 200, max_hz: 4000 } }',
      'learners: [{ name: floor, objective: untrained, input: [sight] }]', '',
    ].join('\n'));
    expect(await senseCommand(['--config', join(dir, 'c.yaml'), '--at', '2,1,east', '--json'])).toBe(0);
    const r = JSON.parse(out.join('\n'));
    expect(r.sight.shape).toEqual([2, 3, 3]);
    expect(r.sound.left_db).toHaveLength(24);
    // min_hz and max_hz are the centres of the first and last band, not band edges.
    expect([r.sound.bands_hz[0], r.sound.bands_hz[23]]).toEqual([200, 4000]);
  });

  it('prints the config problems as the loader words them and exits 1', async () => {
    writeFileSync(join(dir, 'c.yaml'), 'name: x\nworld: closet.yaml\nsenses: { sound: { bandz: 24 } }\nlearners: [{ name: a, objective: untrained, input: [sight] }]\n');
    expect(await senseCommand(['--config', join(dir, 'c.yaml'), '--at', '2,1,east'])).toBe(1);
    expect(err).toEqual(checkConfigFile(join(dir, 'c.yaml')).map((problem) => `crosswise sense: ${problem}`));
    expect(err[0]).toMatch(/c\.yaml:3:\d+: senses\.sound\.bandz: .*did you mean 'bands'/);
  });

  it('takes a world file or --config, not both', async () => {
    expect(await senseCommand([join(dir, 'closet.yaml'), '--config', join(dir, 'c.yaml'), '--at', '2,1,east'])).toBe(1);
    expect(err).toEqual([
      'crosswise sense: give <world> or --config FILE, not both (usage: crosswise sense (<world> | --config FILE) --at X,Y,HEADING [--action A] [--step N] [--json])',
    ]);
  });
});

describe('crosswise sense without --json', () => {
  it('prints a readable table headed by the world, pose, action and step', async () => {
    expect(await senseCommand([join(dir, 'closet.yaml'), '--at', '2,1,east', '--action', 'forward', '--step', '3'])).toBe(0);
    const lines = out.join('\n').split('\n');
    expect(lines[0]).toBe("closet: x=2 y=1 facing east, after 'forward', step 3");
    expect(lines[2]).toBe('  d0  0.00 0.00 0.00 | 0.25 0.25 0.25 | 0.00 0.00 1.00 | 0.25 0.25 0.25 | 0.00 0.00 0.00');
    expect(lines).toContain('  nearest_emitter     buzzer');
    expect(lines).toContain('touch: whisker contact 0/1, bump force in full-speed bumps, footfall vibration 0..1');
    expect(lines).toContain('  whisker_left=1  whisker_front=1  whisker_right=1  bump_force=0  footfall_0=0.1  footfall_1=0.2  footfall_2=0.3  footfall_3=0.4');
  });
});

describe('crosswise sense argument errors', () => {
  it('rejects a missing --at with one line and exit 1', async () => {
    expect(await senseCommand([join(dir, 'closet.yaml')])).toBe(1);
    expect(err).toHaveLength(1);
    expect(err[0]).toMatch(/^crosswise sense: --at X,Y,HEADING is required/);
  });

  it('rejects a solid cell, an unknown heading and an unknown action', async () => {
    expect(await senseCommand([join(dir, 'closet.yaml'), '--at', '0,0,east'])).toBe(1);
    expect(await senseCommand([join(dir, 'closet.yaml'), '--at', '1,1,up'])).toBe(1);
    expect(await senseCommand([join(dir, 'closet.yaml'), '--at', '1,1,east', '--action', 'jump'])).toBe(1);
    expect(err).toEqual([
      'crosswise sense: --at: x=0, y=0 is a solid cell; the agent cannot stand there',
      "crosswise sense: --at: heading must be one of north, east, south, west, got 'up'",
      "crosswise sense: --action: expected one of forward, back, turn-left, turn-right, stay, got 'jump'",
    ]);
  });

  it('prints the world file problems and exits 1 for an invalid world', async () => {
    writeFileSync(join(dir, 'bad.yaml'), CLOSET.replace('cell_size_m', 'cell_size'));
    expect(await senseCommand([join(dir, 'bad.yaml'), '--at', '1,1,east'])).toBe(1);
    expect(err.join('\n').split('\n')).toEqual([
      `crosswise sense: ${join(dir, 'bad.yaml')}:1:1: cell_size_m: required, missing from the world`,
      `crosswise sense: ${join(dir, 'bad.yaml')}:2:1: cell_size: unknown key (did you mean 'cell_size_m'?); `
        + 'expected one of name, description, cell_size_m, ambient_db, wall_loss_db, materials, emitters, start, map',
    ]);
  });
});
