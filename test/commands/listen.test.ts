import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { collect } from '../../src/collect/collector.js';
import { listenCommand } from '../../src/commands/listen.js';
import { recordCommand } from '../../src/commands/record.js';
import { loadSweep } from '../../src/experiment/config.js';
import { planCells } from '../../src/experiment/plan.js';
import { createRng } from '../../src/random.js';
import { readRecording } from '../../src/results/recording.js';
import { writeWavFile } from '../../src/results/wav.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { bandCentresHz } from '../../src/senses/mel.js';
import { senseAll } from '../../src/senses/sense-all.js';
import { bandRms, createSoundRenderer } from '../../src/senses/sound-synthesis.js';
import { loadWorld } from '../../src/world/parse.js';
import { readWav } from '../results/read-wav.js';

const STEP = 4410;
const FADE = 441;
const GREENHOUSE = resolve('worlds/greenhouse.yaml');

let dir: string;
let out: string[];
let err: string[];

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'crosswise-listen-'));
  [out, err] = [[], []];
  vi.spyOn(console, 'log').mockImplementation((line: string) => { out.push(line); });
  vi.spyOn(console, 'error').mockImplementation((line: string) => { err.push(line); });
});

afterEach(() => vi.restoreAllMocks());

const energy = (x: ArrayLike<number>, from = 0, to = x.length) => {
  let sum = 0;
  for (let i = from; i < to; i++) sum += x[i] * x[i];
  return sum;
};
const rmsDb = (x: ArrayLike<number>, from: number, to: number) => 10 * Math.log10(energy(x, from, to) / (to - from));
/** An ear's RMS in dBFS from its band levels: bands add in power, each at 10^((L − 100)/20) full scale. */
const expectedDbfs = (levels: ArrayLike<number>) => 10 * Math.log10(Array.from(levels).reduce((sum, l) => sum + bandRms(l) ** 2, 0));

/** The per-step dB error between a file's ears and the band levels of the walk it renders. */
function stepErrors(path: string, sound: Float32Array, steps: number, bands: number): number[] {
  const wav = readWav(path);
  const errors: number[] = [];
  for (let t = 0; t < steps; t++) {
    for (const ear of [0, 1]) {
      const levels = sound.subarray((2 * t + ear) * bands, (2 * t + ear + 1) * bands);
      errors.push(rmsDb(wav.samples[ear], t * STEP + FADE, (t + 1) * STEP) - expectedDbfs(levels));
    }
  }
  return errors;
}

describe('crosswise listen on a world, read back with the wavefile library', () => {
  it('writes 20 steps as 2.0 s of stereo 44.1 kHz 16-bit PCM and says so', async () => {
    const path = join(dir, 'walk.wav');
    expect(await listenCommand([GREENHOUSE, '--steps', '20', '--out', path])).toBe(0);
    const wav = readWav(path);
    expect([wav.audioFormat, wav.sampleRate, wav.channels, wav.bitsPerSample]).toEqual([1, 44_100, 2, 16]);
    expect(wav.samples[0].length / wav.sampleRate).toBe(2);
    expect(out).toHaveLength(1);
    expect(out[0]).toMatch(new RegExp(`^wrote ${path}: 20 steps of greenhouse \\(wander, seed 1\\), 2\\.0 s, stereo, 44100 Hz, 16-bit; loudest sample -\\d+\\.\\d dBFS at 100 dB = 0 dBFS$`));
  });

  it('follows the walk: each ear of each step within 2 dB of the level its bands sum to, 0.5 dB on average', async () => {
    // The same walk the command collects: wander, seed 4, one episode of 20 steps.
    const path = join(dir, 'walk.wav');
    expect(await listenCommand([GREENHOUSE, '--steps', '20', '--seed', '4', '--out', path])).toBe(0);
    const walk = collect(loadWorld(GREENHOUSE), { policy: 'wander', steps: 20, episodeSteps: 20 }, DEFAULT_SENSE_SETTINGS, 4);
    const errors = stepErrors(path, walk.channels.sound, 20, 16);
    // A step's 0.09 s measured after the crossfade scatters by ~1/√(B·T) in power: for the
    // loudest greenhouse bands (the fan, 250 Hz, B ≈ 90 Hz) B·T ≈ 8, up to about ±1.5 dB.
    expect(Math.max(...errors.map(Math.abs))).toBeLessThan(2);
    expect(Math.abs(errors.reduce((a, b) => a + b, 0) / errors.length)).toBeLessThan(0.5);
  });

  it('draws the same file from the same seed', async () => {
    const [a, b] = [join(dir, 'a.wav'), join(dir, 'b.wav')];
    await listenCommand([GREENHOUSE, '--steps', '5', '--out', a]);
    await listenCommand([GREENHOUSE, '--steps', '5', '--out', b]);
    expect(readFileSync(a).equals(readFileSync(b))).toBe(true);
  });
});

/**
 * 2 s of the greenhouse heard at (2, 1) facing north, the fan one cell west (on the
 * left): the fan at (1, 1) runs always, and at step 1 the tap (period 5, duty 0.2) is off.
 */
function fanOnTheLeft(path: string): Float32Array {
  const world = loadWorld(GREENHOUSE);
  const pose = { x: 2, y: 1, heading: 'north' as const };
  const { sound } = senseAll(world, pose, { pose, moved: false, bumped: false }, 'stay', 1, DEFAULT_SENSE_SETTINGS);
  const render = createSoundRenderer(bandCentresHz(DEFAULT_SENSE_SETTINGS), createRng(1, 'listen'));
  writeWavFile(path, { sampleRateHz: 44_100, channels: 2 }, 20 * STEP, Array.from({ length: 20 }, () => {
    const { left, right } = render(sound);
    return [left, right];
  }));
  return sound;
}

describe('the louder ear', () => {
  it('carries more energy with the greenhouse fan on the left', () => {
    // Every band is louder in the left ear (the head shadows the right), and the file's
    // energy ratio matches the ratio of the ears' summed band powers (1.17 dB) within 0.2 dB.
    const path = join(dir, 'fan-left.wav');
    const sound = fanOnTheLeft(path);
    for (let b = 0; b < 16; b++) expect(sound[b]).toBeGreaterThan(sound[16 + b]);
    const wav = readWav(path);
    const measured = 10 * Math.log10(energy(wav.samples[0], STEP) / energy(wav.samples[1], STEP));
    const expected = expectedDbfs(sound.subarray(0, 16)) - expectedDbfs(sound.subarray(16));
    expect(measured).toBeGreaterThan(0);
    expect(Math.abs(measured - expected)).toBeLessThan(0.2);
  });
});

describe('crosswise listen --config', () => {
  const config = (extra = '') => {
    const path = join(dir, 'c.yaml');
    writeFileSync(path, [
      'name: ears', `world: ${GREENHOUSE}`, 'seeds: [5, 6]',
      'collect: { policy: uniform, steps: 120, episode_steps: 40 }',
      'senses: { sound: { bands: 8, min_hz: 200, max_hz: 6000 } }',
      'learners: [{ name: floor, objective: untrained, input: [sight] }]', extra, '',
    ].join('\n'));
    return path;
  };

  it('renders exactly the walk cell 1 collected, with its 8 bands, across its episode starts', async () => {
    const path = join(dir, 'cell.wav');
    expect(await listenCommand(['--config', config(), '--index', '1', '--steps', '60', '--out', path])).toBe(0);
    const cell = planCells(loadSweep(join(dir, 'c.yaml')))[1];
    expect(cell.seed).toBe(6);
    const walk = collect(loadWorld(GREENHOUSE), { policy: 'uniform', steps: 120, episodeSteps: 40 }, cell.senses, 6);
    const errors = stepErrors(path, walk.channels.sound, 60, 8);
    // Tolerance as for the world's walk above.
    expect(Math.max(...errors.map(Math.abs))).toBeLessThan(2);
    expect(out[0]).toContain(`60 steps of greenhouse (cell 1 [${cell.id}]: uniform, seed 6)`);
  });

  it("renders a cell's whole walk when it is shorter than the 300 steps of the default", async () => {
    const path = join(dir, 'cell.wav');
    expect(await listenCommand(['--config', config(), '--index', '0', '--out', path])).toBe(0);
    expect(readWav(path).samples[0].length).toBe(120 * STEP);
  });

  it('refuses --seed and --policy with --index, more steps than the cell collected, and an index out of range', async () => {
    const path = config();
    const wav = join(dir, 'x.wav');
    expect(await listenCommand(['--config', path, '--index', '0', '--seed', '2', '--out', wav])).toBe(1);
    expect(await listenCommand(['--config', path, '--index', '0', '--steps', '121', '--out', wav])).toBe(1);
    expect(await listenCommand(['--config', path, '--index', '2', '--out', wav])).toBe(1);
    expect(err).toEqual([
      "crosswise listen: --index renders the cell's own walk: drop --seed and --policy",
      'crosswise listen: --steps 121 is more than the 120 steps cell 0 collected',
      "crosswise listen: --index: expected a whole number from 0 to 1, got '2'",
    ]);
    expect(existsSync(wav)).toBe(false);
  });

  it('prints the config loader\'s lines for an invalid config and writes nothing', async () => {
    const path = config('probe: { targetz: [x] }');
    const wav = join(dir, 'x.wav');
    expect(await listenCommand(['--config', path, '--out', wav])).toBe(1);
    expect(err.length).toBeGreaterThan(0);
    expect(err[0]).toMatch(/c\.yaml:7:\d+: probe\.targetz: /);
    expect(existsSync(wav)).toBe(false);
  });
});

describe('crosswise listen --replay', () => {
  const record = async (...args: string[]) => {
    const folder = join(dir, 'walk');
    expect(await recordCommand([GREENHOUSE, ...args, '--out', folder])).toBe(0);
    out.length = 0;
    return folder;
  };

  it('renders a recording\'s sound: each ear of each step within 2 dB of its recorded bands', async () => {
    const folder = await record('--steps', '30', '--seed', '4', '--policy', 'uniform');
    const path = join(dir, 'replay.wav');
    expect(await listenCommand(['--replay', folder, '--steps', '20', '--out', path])).toBe(0);
    const errors = stepErrors(path, readRecording(folder).channels.sound, 20, 16);
    // Tolerance as for the world's walk above.
    expect(Math.max(...errors.map(Math.abs))).toBeLessThan(2);
    expect(out).toEqual([expect.stringContaining(`wrote ${path}: 20 steps of greenhouse (recording ${folder}: uniform, seed 4), 2.0 s,`)]);
  });

  it('writes the very file listen writes for the same walk of the world (one episode, same seed)', async () => {
    // record walks in episodes of 200 steps, listen on a world in one episode: for 25 steps both are one episode.
    const folder = await record('--steps', '25', '--seed', '8');
    const [replayed, walked] = [join(dir, 'replayed.wav'), join(dir, 'walked.wav')];
    expect(await listenCommand(['--replay', folder, '--out', replayed])).toBe(0);
    expect(await listenCommand([GREENHOUSE, '--steps', '25', '--seed', '8', '--out', walked])).toBe(0);
    expect(readFileSync(replayed).equals(readFileSync(walked))).toBe(true);
    expect(readWav(replayed).samples[0].length).toBe(25 * STEP); // the whole recording when shorter than 300 steps
  });

  it('refuses a folder that is no recording and the options that choose another walk, writing nothing', async () => {
    const folder = await record('--steps', '10');
    const wav = join(dir, 'x.wav');
    expect(await listenCommand(['--replay', dir, '--out', wav])).toBe(1);
    expect(await listenCommand(['--replay', folder, '--seed', '3', '--policy', 'seek', '--out', wav])).toBe(1);
    expect(err).toEqual([
      `crosswise listen: --replay: ${dir}: not a recording (no manifest.json; crosswise record writes one)`,
      "crosswise listen: --replay renders the recording's own walk: drop --seed, --policy",
    ]);
    expect(existsSync(wav)).toBe(false);
  });
});

describe('crosswise listen argument errors', () => {
  it('needs --out, a world or a config, and a known policy', async () => {
    expect(await listenCommand([GREENHOUSE])).toBe(1);
    expect(await listenCommand(['--out', join(dir, 'x.wav')])).toBe(1);
    expect(await listenCommand([GREENHOUSE, '--policy', 'run', '--out', join(dir, 'x.wav')])).toBe(1);
    expect(await listenCommand([GREENHOUSE, '--index', '0', '--out', join(dir, 'x.wav')])).toBe(1);
    expect(err).toEqual([
      'crosswise listen: --out FILE.wav is required (the WAV file to write)',
      'crosswise listen: missing <world>, --config FILE or --replay DIR (usage: crosswise listen (<world> | --config FILE | --replay DIR) [--index I] [--steps N] '
        + '[--seed S] [--policy P] --out FILE.wav)',
      "crosswise listen: --policy: expected one of wander, uniform, seek, got 'run'",
      'crosswise listen: --index names a cell of a config; give --config too',
    ]);
  });
});

const hasSox = spawnSync('sox', ['--version']).status === 0;
if (!hasSox) console.warn('skipping the sox checks of crosswise listen: sox is not installed (.ci/run installs it)');

describe.skipIf(!hasSox)('sox reads what crosswise listen writes', () => {
  const sox = (...args: string[]) => spawnSync('sox', args, { encoding: 'utf8' });

  it('reports 2 channels, 44100 Hz, 16-bit and 1.5 s for a replayed recording of 15 steps (sox --i)', async () => {
    const folder = join(dir, 'walk');
    await recordCommand([GREENHOUSE, '--steps', '15', '--out', folder]);
    const path = join(dir, 'replay.wav');
    expect(await listenCommand(['--replay', folder, '--out', path])).toBe(0);
    const info = sox('--i', path).stdout;
    expect(info).toMatch(/Channels\s*: 2/);
    expect(info).toMatch(/Sample Rate\s*: 44100/);
    expect(info).toMatch(/Precision\s*: 16-bit/);
    expect(info).toMatch(/Duration\s*: 00:00:01\.50 = 66150 samples/);
  });

  it('reports 2 channels, 44100 Hz, 16-bit and 2 s for 20 steps (sox --i)', async () => {
    const path = join(dir, 'walk.wav');
    await listenCommand([GREENHOUSE, '--steps', '20', '--out', path]);
    const info = sox('--i', path).stdout;
    expect(info).toMatch(/Channels\s*: 2/);
    expect(info).toMatch(/Sample Rate\s*: 44100/);
    expect(info).toMatch(/Precision\s*: 16-bit/);
    expect(info).toMatch(/Duration\s*: 00:00:02\.00 = 88200 samples/);
  });

  it('measures the left ear louder than the right with the fan on the left, each within 0.2 dB of its bands\' sum (sox stat)', () => {
    const path = join(dir, 'fan-left.wav');
    const sound = fanOnTheLeft(path);
    const rmsDbfs = (channel: string) => 20 * Math.log10(Number(/RMS\s+amplitude:\s+([\d.]+)/.exec(sox(path, '-n', 'trim', '0.1', 'remix', channel, 'stat').stderr)?.[1]));
    const [left, right] = [rmsDbfs('1'), rmsDbfs('2')];
    expect(left).toBeGreaterThan(right);
    expect(Math.abs(left - expectedDbfs(sound.subarray(0, 16)))).toBeLessThan(0.2);
    expect(Math.abs(right - expectedDbfs(sound.subarray(16)))).toBeLessThan(0.2);
  });

  it('measures one 1 kHz band at 70 dB as −30 dBFS RMS within 0.3 dB (sox stat, left channel)', () => {
    const centres = bandCentresHz(DEFAULT_SENSE_SETTINGS);
    const levels = new Float32Array(32).fill(-200);
    const band = centres.findIndex((hz) => hz > 1000);
    levels[band] = 70;
    levels[16 + band] = 70;
    const render = createSoundRenderer(centres, createRng(1, 'listen'));
    const path = join(dir, 'band.wav');
    writeWavFile(path, { sampleRateHz: 44_100, channels: 2 }, 50 * STEP, Array.from({ length: 50 }, () => {
      const { left, right } = render(levels);
      return [left, right];
    }));
    // sox stat prints its figures on stderr; the first 0.1 s fades in, so trim it.
    const stat = sox(path, '-n', 'trim', '0.1', 'remix', '1', 'stat').stderr;
    const rms = Number(/RMS\s+amplitude:\s+([\d.]+)/.exec(stat)?.[1]);
    expect(Math.abs(20 * Math.log10(rms) - -30)).toBeLessThan(0.3);
  });
});
