import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { recordCommand } from '../../src/commands/record.js';
import { senseReport } from '../../src/commands/sense.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { readRecording } from '../../src/results/recording.js';
import { loadWorld } from '../../src/world/parse.js';
import { ACTIONS, HEADINGS } from '../../src/world/types.js';

const GREENHOUSE = resolve('worlds/greenhouse.yaml');

// A python3 that can import numpy (Debian's python3-numpy installs for /usr/bin/python3).
const PYTHON = ['python3', '/usr/bin/python3'].find((p) => spawnSync(p, ['-c', 'import numpy']).status === 0);
if (PYTHON == null) console.warn('skipping the NumPy checks of crosswise record: no python3 with numpy');

let dir: string;
let out: string[];
let err: string[];

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'crosswise-record-'));
  [out, err] = [[], []];
  vi.spyOn(console, 'log').mockImplementation((line: string) => { out.push(line); });
  vi.spyOn(console, 'error').mockImplementation((line: string) => { err.push(line); });
});

afterEach(() => vi.restoreAllMocks());

/** Runs a Python script with numpy on the given arguments and parses the JSON it prints. */
function python(script: string, ...args: string[]): unknown {
  const result = spawnSync(PYTHON as string, ['-c', script, ...args], { encoding: 'utf8' });
  expect(result.stderr).toBe('');
  return JSON.parse(result.stdout);
}

describe('crosswise record on a world', () => {
  it('writes the nine files in a new folder, leaves no temporary folder, and says what it wrote', async () => {
    const folder = join(dir, 'walk');
    expect(await recordCommand([GREENHOUSE, '--steps', '600', '--seed', '3', '--out', folder])).toBe(0);
    expect(readdirSync(folder).sort()).toEqual([
      'actions.npy', 'episodes.npy', 'latents.npy', 'manifest.json', 'motor.npy', 'sight.npy', 'sound.npy', 'split.npy', 'touch.npy',
    ]);
    expect(readdirSync(dir)).toEqual(['walk']);
    // 600 steps are 3 episodes of 200: round(0.7 · 3) = 2 train, round(0.15 · 3) = 0 validation, 1 test.
    expect(out).toEqual([expect.stringMatching(new RegExp(`^wrote ${folder}: 600 steps of greenhouse \\(wander, seed 3\\), 9 files, 0\\.3 MB; `
      + 'steps per split: train 400, validation 0, test 200$'))]);
  });

  it('draws the same bytes from the same seed', async () => {
    await recordCommand([GREENHOUSE, '--steps', '300', '--out', join(dir, 'a')]);
    await recordCommand([GREENHOUSE, '--steps', '300', '--out', join(dir, 'b')]);
    for (const file of readdirSync(join(dir, 'a'))) expect(readFileSync(join(dir, 'a', file)).equals(readFileSync(join(dir, 'b', file)))).toBe(true);
  });

  it('records at every step what crosswise sense reports at that pose, action and step', async () => {
    // crosswise sense computes one pose from scratch; the collector reuses per-pose tables.
    // sense --json rounds to 6 decimals (sound to 4), hence the tolerances.
    const folder = join(dir, 'walk');
    await recordCommand([GREENHOUSE, '--steps', '400', '--seed', '5', '--policy', 'uniform', '--out', folder]);
    const recording = readRecording(folder);
    const world = loadWorld(GREENHOUSE);
    const columns = recording.manifest.files['latents.npy'].columns ?? [];
    for (const t of [0, 1, 2, 57, 199, 200, 201, 399]) {
      const row = (values: Float32Array, width: number) => Array.from(values.subarray(t * width, (t + 1) * width));
      const [x, y, heading] = row(recording.latents, 12);
      const report = senseReport(world, { x, y, heading: HEADINGS[heading] }, ACTIONS[recording.actions[t]], t, DEFAULT_SENSE_SETTINGS);
      if (typeof report === 'string') throw new Error(report);
      row(recording.channels.sight, 60).forEach((v, i) => expect(v).toBeCloseTo(report.sight.values.flat(2)[i], 6));
      row(recording.channels.sound, 32).forEach((v, i) => expect(v).toBeCloseTo([...report.sound.left_db, ...report.sound.right_db][i], 4));
      row(recording.channels.touch, 8).forEach((v, i) => expect(v).toBeCloseTo(report.touch.values[i], 6));
      expect(row(recording.channels.motor, 5)).toEqual(report.motor.values);
      row(recording.latents, 12).forEach((v, j) => {
        const { name, kind, classes } = columns[j];
        const expected = report.latents[name];
        if (kind === 'continuous') expect(v).toBeCloseTo(expected as number, 5);
        else expect(classes?.[v] === 'yes' ? true : classes?.[v] === 'no' ? false : classes?.[v]).toBe(expected);
      });
    }
    // Episodes restart on the world clock: step 200 is the first of episode 1, placed with 'stay'.
    expect([recording.episodes[199], recording.episodes[200], ACTIONS[recording.actions[200]]]).toEqual([0, 1, 'stay']);
  });
});

describe.skipIf(PYTHON == null)('a recording in NumPy (skipped without python3 and numpy)', () => {
  it('loads every file with a bare np.load, with the shape and dtype the manifest documents', async () => {
    const folder = join(dir, 'walk');
    await recordCommand([GREENHOUSE, '--steps', '600', '--seed', '3', '--out', folder]);
    const loaded = python(`import json, sys, numpy as np
folder = sys.argv[1]
manifest = json.load(open(folder + '/manifest.json'))
print(json.dumps({f: [list(np.load(folder + '/' + f).shape), np.load(folder + '/' + f).dtype.str] for f in manifest['files']}))`, folder);
    // The documented shapes: sight [steps, depth 4, width 5, rgb 3], sound [steps, 2 ears, 16 bands],
    // touch [steps, 3 whiskers + bump + 4 footfall], motor [steps, 5 actions], latents [steps, 12].
    expect(loaded).toEqual({
      'sight.npy': [[600, 4, 5, 3], '<f4'],
      'sound.npy': [[600, 2, 16], '<f4'],
      'touch.npy': [[600, 8], '<f4'],
      'motor.npy': [[600, 5], '<f4'],
      'latents.npy': [[600, 12], '<f4'],
      'actions.npy': [[600], '|u1'],
      'episodes.npy': [[600], '<i4'],
      'split.npy': [[600], '|u1'],
    });
  });

  it('reads the same numbers NumPy reads: the first step, the split counts and the episode starts', async () => {
    const folder = join(dir, 'walk');
    await recordCommand([GREENHOUSE, '--steps', '600', '--seed', '3', '--out', folder]);
    const numpy = python(`import json, sys, numpy as np
d = sys.argv[1] + '/'
print(json.dumps({
  'sight0': np.load(d + 'sight.npy')[0, 0].tolist(),
  'sound0': np.load(d + 'sound.npy')[0, :, 0].tolist(),
  'split': np.bincount(np.load(d + 'split.npy'), minlength=3).tolist(),
  'starts': np.flatnonzero(np.diff(np.load(d + 'episodes.npy'))).tolist(),
  'moves': int(np.load(d + 'motor.npy')[:, 0].sum()),
}))`, folder) as Record<string, unknown>;
    const recording = readRecording(folder);
    expect(numpy.sight0).toEqual([0, 1, 2, 3, 4].map((w) => Array.from(recording.channels.sight.subarray(3 * w, 3 * w + 3))));
    expect(numpy.sound0).toEqual([recording.channels.sound[0], recording.channels.sound[16]]);
    expect(numpy.split).toEqual([400, 0, 200]);
    expect(numpy.starts).toEqual([199, 399]);
    expect(numpy.moves).toBe(recording.actions.filter((a) => ACTIONS[a] === 'forward').length);
  });
});

describe('crosswise record errors', () => {
  const config = () => {
    const path = join(dir, 'c.yaml');
    writeFileSync(path, [
      'name: rec', `world: ${GREENHOUSE}`, 'seeds: [5]',
      'collect: { steps: 200, episode_steps: 50 }',
      'learners: [{ name: floor, objective: untrained, input: [sight] }]', '',
    ].join('\n'));
    return path;
  };

  it('refuses bad command lines with one line each and exit code 1, writing nothing', async () => {
    const folder = join(dir, 'x');
    const cases = [
      [GREENHOUSE, '--index', '0', '--out', folder],
      ['--config', config(), '--out', folder],
      ['--config', config(), '--index', '0', '--seed', '2', '--steps', '10', '--out', folder],
      ['--config', config(), '--index', '1', '--out', folder],
      [GREENHOUSE, '--noise', 'sight:gaussian', '--out', folder],
      [GREENHOUSE, '--noise', 'sight:gausian:2', '--out', folder],
      [GREENHOUSE, '--noise', 'sound:masking:0', '--out', folder],
      [GREENHOUSE, '--noise', 'touch:masking:2', '--out', folder],
      [GREENHOUSE, '--noise', 'sight:gaussian:9', '--out', folder],
      [GREENHOUSE, '--noise', 'sight:gaussian:1,sight:dropout:2', '--out', folder],
      [GREENHOUSE, '--steps', '100', '--noise', 'sight:gaussian:1', '--out', folder],
      [GREENHOUSE, '--out', join(dir, 'no', 'such', 'folder')],
    ];
    for (const args of cases) expect(await recordCommand(args)).toBe(1);
    expect(err).toEqual([
      'crosswise record: --index names a cell of a config; give --config too',
      'crosswise record: --config records one cell: give --index I (crosswise plan lists the cells)',
      "crosswise record: --index records the cell's own data: drop --seed, --steps",
      "crosswise record: --index: expected a whole number from 0 to 0, got '1'",
      "crosswise record: --noise: expected CHANNEL:KIND:SEVERITY (e.g. sight:gaussian:3), got 'sight:gaussian'",
      "crosswise record: --noise 'sight:gausian:2': kind: expected one of gaussian | dropout | blackout | masking, got 'gausian'",
      "crosswise record: --noise 'sound:masking:0': severity 0 is the clean input; give 1 or more",
      "crosswise record: --noise 'touch:masking:2': channel: masking noise applies to sound only, got 'touch'",
      "crosswise record: --noise 'sight:gaussian:9': severity: severity 9 has no row in the severity table (0..5); give explicit parameters",
      'crosswise record: --noise: sight is listed twice; a channel takes one corruption',
      'crosswise record: --noise: the recording has no test steps to corrupt (100 steps make too few episodes of 200)',
      `crosswise record: --out: the folder ${join(dir, 'no', 'such')} does not exist`,
    ]);
    expect(readdirSync(dir).sort()).toEqual(['c.yaml']);
  });

  it('will not write into a folder that exists', async () => {
    const folder = join(dir, 'walk');
    await recordCommand([GREENHOUSE, '--steps', '50', '--out', folder]);
    const before = readFileSync(join(folder, 'manifest.json'));
    expect(await recordCommand([GREENHOUSE, '--steps', '60', '--out', folder])).toBe(1);
    expect(err).toEqual([`crosswise record: --out: ${folder} already exists; give a new folder`]);
    expect(readFileSync(join(folder, 'manifest.json')).equals(before)).toBe(true);
  });

  it("names the world file's line for an invalid world and writes nothing", async () => {
    const world = join(dir, 'bad.yaml');
    writeFileSync(world, readFileSync(GREENHOUSE, 'utf8').replace('cell_size_m: 0.5', 'cell_size_m: -1'));
    expect(await recordCommand([world, '--out', join(dir, 'x')])).toBe(1);
    expect(err[0]).toMatch(/^crosswise record: .*bad\.yaml:\d+:\d+: /);
    expect(existsSync(join(dir, 'x'))).toBe(false);
  });
});
