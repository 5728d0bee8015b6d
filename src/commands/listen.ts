import { existsSync, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { collect, type CollectOptions } from '../collect/collector.js';
import { loadSweep } from '../experiment/config.js';
import { readWorldFile } from '../experiment/file-kind.js';
import { planCells } from '../experiment/plan.js';
import { createRng } from '../random.js';
import { manifestSenses } from '../results/recording.js';
import { writeWavFile } from '../results/wav.js';
import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';
import { bandCentresHz } from '../senses/mel.js';
import { audioBandsProblem, createSoundRenderer, FULL_SCALE_DB, SAMPLE_RATE_HZ, STEP_SECONDS } from '../senses/sound-synthesis.js';
import { runAction } from './command-line.js';
import { CONFIG_HINT } from './config-senses.js';
import { EXIT } from './exit-codes.js';
import { listenUsage } from './listen-usage.js';
import { printProblem } from './messages.js';
import { readReplayFolder } from './replay-folder.js';
import { UsageError, type ParsedArguments } from './usage.js';

const DEFAULT_STEPS = 300;

/** A walk to collect and render: where, with which senses, and how it was collected. */
interface Walk {
  readonly worldPath: string;
  readonly senses: SenseSettings;
  readonly collect: CollectOptions;
  readonly seed: number;
  /** Steps of the collected walk to render, from its start. */
  readonly steps: number;
  readonly label: string;
}

/** Band levels to render, [steps, 2, bands] or longer, and what they are. */
interface Heard {
  readonly sound: Float32Array;
  readonly senses: SenseSettings;
  /** Seed of the walk; the band noise is drawn from its `listen` stream. */
  readonly seed: number;
  readonly steps: number;
  readonly worldName: string;
  readonly label: string;
}

type ListenValues = ParsedArguments<typeof listenUsage.options>['values'];

/** The walk the command line asks for: a world file's, a config's, or exactly a cell's. */
function chooseWalk(world: string | undefined, args: ListenValues): Walk {
  if (args.index != null && args.config == null) throw new UsageError('--index names a cell of a config; give --config too');
  if (args.index != null && (args.seed != null || args.policy != null)) throw new UsageError("--index renders the cell's own walk: drop --seed and --policy");
  const steps = args.steps ?? DEFAULT_STEPS;
  if (args.config == null) {
    const worldPath = world as string;
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
  if (args.index >= cells.length) throw new UsageError(`--index: expected a whole number from 0 to ${cells.length - 1}, got '${args.index}'`);
  const cell = cells[args.index];
  const { policy, steps: cellSteps, episodeSteps } = cell.collect;
  if (args.steps != null && args.steps > cellSteps) throw new UsageError(`--steps ${args.steps} is more than the ${cellSteps} steps cell ${args.index} collected`);
  return {
    worldPath: cell.world.path, senses: cell.senses, collect: { policy, steps: cellSteps, episodeSteps }, seed: cell.seed,
    steps: Math.min(steps, cellSteps), label: `cell ${args.index} [${cell.id}]: ${policy}, seed ${cell.seed}`,
  };
}

/** Collects a walk: its sound as the agent heard it. */
function hearWalk(walk: Walk): Heard {
  const world = readWorldFile(walk.worldPath, CONFIG_HINT);
  const data = collect(world, walk.collect, walk.senses, walk.seed);
  return { sound: data.channels.sound, senses: walk.senses, seed: walk.seed, steps: walk.steps, worldName: world.name, label: walk.label };
}

/** A recording's sound as recorded (test steps corrupted when it was recorded with sound noise). */
function hearRecording(args: ListenValues): Heard {
  const given = (['config', 'index', 'seed', 'policy'] as const).filter((name) => args[name] != null);
  if (given.length > 0) throw new UsageError(`--replay renders the recording's own walk: drop ${given.map((name) => `--${name}`).join(', ')}`);
  const recording = readReplayFolder(args.replay as string);
  const { manifest } = recording;
  const noisy = manifest.noise.some((n) => n.channel === 'sound') ? ', sound noise on its test steps' : '';
  return {
    sound: recording.channels.sound, senses: manifestSenses(manifest), seed: manifest.seed, steps: Math.min(args.steps ?? DEFAULT_STEPS, manifest.steps),
    worldName: manifest.world.name, label: `recording ${resolve(args.replay as string)}: ${manifest.collect.policy}, seed ${manifest.seed}${noisy}`,
  };
}

function checkOut(path: string): void {
  if (!existsSync(dirname(path))) throw new UsageError(`--out: the folder ${dirname(path)} does not exist`);
  if (existsSync(path) && statSync(path).isDirectory()) throw new UsageError(`--out: ${path} is a folder; give a file name such as walk.wav`);
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

/** `crosswise listen`: what the agent hears along a walk, as a stereo 44.1 kHz 16-bit WAV file. */
export async function listenCommand(args: readonly string[]): Promise<number> {
  return runAction(listenUsage, args, async ({ operands: [worldArgument], values }) => {
    const source = values.replay != null ? hearRecording(values) : chooseWalk(worldArgument, values);
    const out = resolve(values.out);
    checkOut(out);
    const problem = audioBandsProblem(bandCentresHz(source.senses));
    if (problem != null) throw new UsageError(`${problem}; lower senses.sound.max_hz`);
    return writeSound('sound' in source ? source : hearWalk(source), out);
  });
}

/** Renders the sound to a WAV file; exit code 5 when the file cannot be written. */
function writeSound(heard: Heard, out: string): number {
  const render = createSoundRenderer(bandCentresHz(heard.senses), createRng(heard.seed, 'listen'));
  const frames = heard.steps * Math.round(STEP_SECONDS * SAMPLE_RATE_HZ);
  const peak = { value: 0 };
  let clipped: number;
  try {
    const blocks = stepBlocks(heard.sound, heard.senses.sound.bands, heard.steps, render, peak);
    ({ clipped } = writeWavFile(out, { sampleRateHz: SAMPLE_RATE_HZ, channels: 2 }, frames, blocks));
  } catch (error) {
    printProblem('listen', `cannot write ${out}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
    return EXIT.writeFailed;
  }
  const peakDbfs = peak.value > 0 ? `${(20 * Math.log10(peak.value)).toFixed(1)} dBFS` : 'silence';
  console.log(`wrote ${out}: ${heard.steps} steps of ${heard.worldName} (${heard.label}), ${(heard.steps * STEP_SECONDS).toFixed(1)} s, stereo, `
    + `${SAMPLE_RATE_HZ} Hz, 16-bit; loudest sample ${peakDbfs} at ${FULL_SCALE_DB} dB = 0 dBFS${clipped > 0 ? `; ${clipped} samples clipped` : ''}`);
  return EXIT.success;
}
