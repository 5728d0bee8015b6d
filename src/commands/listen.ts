import { existsSync, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { collect, type CollectOptions } from '../collect/collector.js';
import { POLICY_NAMES, type PolicyName } from '../collect/policies.js';
import { ConfigError } from '../experiment/config-errors.js';
import { loadSweep } from '../experiment/config.js';
import { planCells } from '../experiment/plan.js';
import { createRng } from '../random.js';
import { writeWavFile } from '../results/wav.js';
import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';
import { bandCentresHz } from '../senses/mel.js';
import { audioBandsProblem, createSoundRenderer, FULL_SCALE_DB, SAMPLE_RATE_HZ, STEP_SECONDS } from '../senses/sound-synthesis.js';
import { loadWorld } from '../world/parse.js';
import { WorldFileError } from '../world/problems.js';
import type { World } from '../world/types.js';

const USAGE = 'usage: crosswise listen (WORLD | --config FILE [--index I]) [--steps N] [--seed S] [--policy P] --out FILE.wav';
const DEFAULT_STEPS = 300;

/** A walk to render: where, with which senses, and how it was collected. */
interface Walk {
  readonly worldPath: string;
  readonly senses: SenseSettings;
  readonly collect: CollectOptions;
  readonly seed: number;
  /** Steps of the collected walk to render, from its start. */
  readonly steps: number;
  readonly label: string;
}

/** An input mistake: its lines are printed and the command exits 1. */
class ListenInputError extends Error {
  constructor(readonly lines: readonly string[]) {
    super(lines.join('\n'));
  }
}

const fail = (reason: string): never => { throw new ListenInputError([`crosswise listen: ${reason}`]); };

function wholeNumber(name: string, text: string | undefined, min: number): number | undefined {
  if (text == null) return undefined;
  const value = Number(text);
  if (!/^-?\d+$/.test(text) || value < min) fail(`--${name}: expected a whole number ≥ ${min}, got '${text}'`);
  return value;
}

function parseListenArgs(args: readonly string[]) {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...args], allowPositionals: true, strict: true,
      options: { config: { type: 'string' }, index: { type: 'string' }, steps: { type: 'string' }, seed: { type: 'string' }, policy: { type: 'string' }, out: { type: 'string' } },
    });
  } catch (error) {
    return fail(`${(error as Error).message} (${USAGE})`);
  }
  const { values, positionals } = parsed;
  if (positionals.length > 1) fail(`one world at a time, got ${positionals.join(', ')} (${USAGE})`);
  if ((positionals.length === 1) === (values.config != null)) fail(`give a world file or --config, one of the two (${USAGE})`);
  if (values.index != null && values.config == null) fail('--index names a cell of a config; give --config too');
  if (values.index != null && (values.seed != null || values.policy != null)) fail("--index renders the cell's own walk: drop --seed and --policy");
  if (values.out == null) fail(`--out FILE.wav is required (${USAGE})`);
  if (values.policy != null && !(POLICY_NAMES as readonly string[]).includes(values.policy)) fail(`--policy must be one of ${POLICY_NAMES.join(', ')}, got '${values.policy}'`);
  return {
    world: positionals[0] as string | undefined,
    config: values.config,
    index: wholeNumber('index', values.index, 0),
    steps: wholeNumber('steps', values.steps, 1),
    seed: wholeNumber('seed', values.seed, Number.MIN_SAFE_INTEGER),
    policy: values.policy as PolicyName | undefined,
    out: resolve(values.out as string),
  };
}

type ListenArgs = ReturnType<typeof parseListenArgs>;

/** The walk the command line asks for: a world file's, a config's, or exactly a cell's. */
function chooseWalk(args: ListenArgs): Walk {
  const steps = args.steps ?? DEFAULT_STEPS;
  if (args.config == null) {
    const worldPath = args.world as string;
    const policy = args.policy ?? 'wander';
    const seed = args.seed ?? 1;
    return { worldPath, senses: DEFAULT_SENSE_SETTINGS, collect: { policy, steps, episodeSteps: steps }, seed, steps, label: `${policy}, seed ${seed}` };
  }
  const sweep = loadSweep(args.config);
  if (args.index == null) {
    const { settings } = sweep.combinations[0];
    const policy = args.policy ?? settings.collect.policy;
    const seed = args.seed ?? sweep.seeds[0];
    return { worldPath: settings.worldPath, senses: settings.senses, collect: { policy, steps, episodeSteps: steps }, seed, steps, label: `${policy}, seed ${seed}` };
  }
  const cells = planCells(sweep);
  const cell = cells[args.index] ?? fail(`--index: expected a cell from 0 to ${cells.length - 1}, got ${args.index}`);
  const { policy, steps: cellSteps, episodeSteps } = cell.collect;
  if (steps > cellSteps) fail(`--steps ${steps} is more than the ${cellSteps} steps cell ${args.index} collected`);
  return {
    worldPath: cell.world.path, senses: cell.senses, collect: { policy, steps: cellSteps, episodeSteps }, seed: cell.seed,
    steps: Math.min(args.steps ?? DEFAULT_STEPS, cellSteps), label: `cell ${args.index} [${cell.id}]: ${policy}, seed ${cell.seed}`,
  };
}

function checkOut(path: string): void {
  if (!existsSync(dirname(path))) fail(`--out: the folder ${dirname(path)} does not exist`);
  if (existsSync(path) && statSync(path).isDirectory()) fail(`--out: ${path} is a folder; give a file name such as walk.wav`);
}

/** The walk's band levels as stereo blocks, one per step, with progress on stderr when it is a terminal. */
function* stepBlocks(sound: Float32Array, bands: number, steps: number, render: ReturnType<typeof createSoundRenderer>, peak: { value: number }) {
  for (let t = 0; t < steps; t++) {
    const { left, right } = render(sound.subarray(t * 2 * bands, (t + 1) * 2 * bands));
    for (let i = 0; i < left.length; i++) peak.value = Math.max(peak.value, Math.abs(left[i]), Math.abs(right[i]));
    if (process.stderr.isTTY && (t % 10 === 9 || t === steps - 1)) process.stderr.write(`\rrendering step ${t + 1}/${steps}`);
    yield [left, right];
  }
  if (process.stderr.isTTY) process.stderr.write('\n');
}

/** The walk, its world and the output path; or, after printing why, exit code 1. */
function prepare(args: readonly string[]): { walk: Walk; world: World; out: string } | number {
  try {
    const parsed = parseListenArgs(args);
    const walk = chooseWalk(parsed);
    checkOut(parsed.out);
    const problem = audioBandsProblem(bandCentresHz(walk.senses));
    if (problem != null) fail(`${problem}; lower senses.sound.max_hz`);
    return { walk, world: loadWorld(walk.worldPath), out: parsed.out };
  } catch (error) {
    if (error instanceof ListenInputError || error instanceof ConfigError || error instanceof WorldFileError) {
      console.error(error.message);
      return 1;
    }
    throw error;
  }
}

/** `crosswise listen`: what the agent hears along a walk, as a stereo 44.1 kHz 16-bit WAV file. */
export async function listenCommand(args: readonly string[]): Promise<number> {
  const prepared = prepare(args);
  if (typeof prepared === 'number') return prepared;
  const { walk, world, out } = prepared;
  const data = collect(world, walk.collect, walk.senses, walk.seed);
  const render = createSoundRenderer(bandCentresHz(walk.senses), createRng(walk.seed, 'listen'));
  const frames = walk.steps * Math.round(STEP_SECONDS * SAMPLE_RATE_HZ);
  const peak = { value: 0 };
  let clipped: number;
  try {
    const blocks = stepBlocks(data.channels.sound, walk.senses.sound.bands, walk.steps, render, peak);
    ({ clipped } = writeWavFile(out, { sampleRateHz: SAMPLE_RATE_HZ, channels: 2 }, frames, blocks));
  } catch (error) {
    console.error(`crosswise listen: cannot write ${out}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
    return 5;
  }
  const peakDbfs = peak.value > 0 ? `${(20 * Math.log10(peak.value)).toFixed(1)} dBFS` : 'silence';
  console.log(`wrote ${out}: ${walk.steps} steps of ${world.name} (${walk.label}), ${(walk.steps * STEP_SECONDS).toFixed(1)} s, stereo, `
    + `${SAMPLE_RATE_HZ} Hz, 16-bit; loudest sample ${peakDbfs} at ${FULL_SCALE_DB} dB = 0 dBFS${clipped > 0 ? `; ${clipped} samples clipped` : ''}`);
  return 0;
}
