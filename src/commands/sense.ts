import { LATENT_KIND, LATENT_NAMES, type LatentName } from '../collect/dataset.js';
import { latentClassNames } from '../collect/collector.js';
import { latentsAt } from '../collect/latents.js';
import { ConfigError } from '../experiment/config-errors.js';
import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';
import { bandCentresHz } from '../senses/mel.js';
import { channelEntryNames, channelShape } from '../senses/registry.js';
import { senseAll } from '../senses/sense-all.js';
import { arrivalTransition } from '../world/arrival.js';
import { isBlocked } from '../world/movement.js';
import { loadWorld } from '../world/parse.js';
import { WorldFileError } from '../world/problems.js';
import { ACTIONS, HEADINGS, type Action, type Heading, type Pose, type World } from '../world/types.js';
import { configWorldAndSenses } from './config-senses.js';

const USAGE = 'usage: crosswise sense (<world> | --config FILE) --at X,Y,HEADING [--action A] [--step N] [--json]';

interface SenseArgs {
  readonly worldPath: string | null;
  readonly configPath: string | null;
  readonly at: string;
  readonly action: Action;
  readonly stepIndex: number;
  readonly json: boolean;
}

function parseArgs(args: readonly string[]): SenseArgs | string {
  const positional: string[] = [];
  const options = new Map<string, string>();
  let json = false;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--json') json = true;
    else if (arg === '--at' || arg === '--action' || arg === '--step' || arg === '--config') {
      if (args[i + 1] == null) return `${arg} needs a value`;
      options.set(arg, args[++i]);
    } else if (arg.startsWith('-')) return `unknown option '${arg}'`;
    else positional.push(arg);
  }
  const configPath = options.get('--config') ?? null;
  if (configPath != null && positional.length > 0) return 'give a world file or --config, not both';
  if (configPath == null && positional.length !== 1) return `give exactly one world file, got ${positional.length}`;
  const at = options.get('--at');
  if (at == null) return '--at X,Y,HEADING is required';
  const action = options.get('--action') ?? 'stay';
  if (!(ACTIONS as readonly string[]).includes(action)) return `--action must be one of ${ACTIONS.join(', ')}, got '${action}'`;
  const stepText = options.get('--step') ?? '0';
  const stepIndex = Number(stepText);
  if (!/^\d+$/.test(stepText)) return `--step must be a whole number >= 0, got '${stepText}'`;
  return { worldPath: positional[0] ?? null, configPath, at, action: action as Action, stepIndex, json };
}

function parsePose(world: World, at: string): Pose | string {
  const match = /^(\d+),(\d+),([a-z]+)$/.exec(at.trim());
  if (match == null) return `--at must look like X,Y,HEADING (e.g. 2,3,north), got '${at}'`;
  const [x, y, heading] = [Number(match[1]), Number(match[2]), match[3]];
  if (!(HEADINGS as readonly string[]).includes(heading)) return `heading must be one of ${HEADINGS.join(', ')}, got '${heading}'`;
  if (x >= world.width || y >= world.height) return `x=${x}, y=${y} is outside the ${world.width}×${world.height} map`;
  if (isBlocked(world, x, y)) return `x=${x}, y=${y} is a solid cell; the agent cannot stand there`;
  return { x, y, heading: heading as Heading };
}

/** The `crosswise sense --json` object; sight values nest as [depth][width][rgb]. */
interface SenseReport {
  readonly world: string;
  readonly pose: Pose;
  readonly action: Action;
  readonly step: number;
  readonly sight: { readonly shape: readonly number[]; readonly values: number[][][] };
  readonly sound: { readonly bands_hz: number[]; readonly left_db: number[]; readonly right_db: number[] };
  readonly touch: { readonly names: readonly string[]; readonly values: number[] };
  readonly motor: { readonly names: readonly string[]; readonly values: number[] };
  readonly latents: Readonly<Record<string, unknown>>;
}

const round = (v: number, digits: number) => Number(v.toFixed(digits));

function nest(values: Float32Array, shape: readonly number[]): unknown {
  if (shape.length === 1) return [...values].map((v) => round(v, 6));
  const inner = values.length / shape[0];
  return Array.from({ length: shape[0] }, (_, i) => nest(values.subarray(i * inner, (i + 1) * inner), shape.slice(1)));
}

/** Every channel and latent at one pose as the JSON object of `crosswise sense --json`. */
export function senseReport(
  world: World, pose: Pose, action: Action, stepIndex: number, settings: SenseSettings = DEFAULT_SENSE_SETTINGS,
): SenseReport | string {
  const transition = arrivalTransition(world, pose, action);
  if (typeof transition === 'string') return transition;
  const senses = senseAll(world, pose, transition, action, stepIndex, settings);
  const bands = settings.sound.bands;
  const raw = latentsAt(world, pose, transition, settings);
  const classes = latentClassNames(world);
  const latents = Object.fromEntries(LATENT_NAMES.map((name: LatentName) => {
    const names = classes[name];
    if (LATENT_KIND[name] === 'continuous' || names == null) return [name, round(raw[name], 6)];
    return [name, names[0] === 'no' ? raw[name] === 1 : names[raw[name]]];
  }));
  return {
    world: world.name, pose, action, step: stepIndex,
    sight: { shape: channelShape('sight', settings), values: nest(senses.sight, channelShape('sight', settings)) as number[][][] },
    sound: {
      bands_hz: [...bandCentresHz(settings)].map((f) => round(f, 1)),
      left_db: [...senses.sound.subarray(0, bands)].map((v) => round(v, 4)),
      right_db: [...senses.sound.subarray(bands)].map((v) => round(v, 4)),
    },
    touch: { names: channelEntryNames('touch', settings), values: [...senses.touch].map((v) => round(v, 6)) },
    motor: { names: channelEntryNames('motor', settings), values: [...senses.motor] },
    latents,
  };
}

function table(r: SenseReport): string {
  const cell = (v: number[]) => v.map((c) => c.toFixed(2)).join(' ');
  const pad = (s: string | number, n: number) => String(s).padStart(n);
  return [
    `${r.world}: x=${r.pose.x} y=${r.pose.y} facing ${r.pose.heading}, after '${r.action}', step ${r.step}`,
    'sight (r g b per cell; row d0 nearest, leftmost column first)',
    ...r.sight.values.map((row, d) => `  d${d}  ${row.map(cell).join(' | ')}`),
    'sound (dB)',
    `  band Hz ${r.sound.bands_hz.map((f) => pad(Math.round(f), 6)).join('')}`,
    `  left    ${r.sound.left_db.map((v) => pad(v.toFixed(1), 6)).join('')}`,
    `  right   ${r.sound.right_db.map((v) => pad(v.toFixed(1), 6)).join('')}`,
    `touch    ${r.touch.names.map((n, i) => `${n}=${r.touch.values[i]}`).join('  ')}`,
    `motor    ${r.motor.names.map((n, i) => `${n}=${r.motor.values[i]}`).join('  ')}`,
    'latents',
    ...Object.entries(r.latents).map(([k, v]) => `  ${k.padEnd(20)}${String(v)}`),
  ].join('\n');
}

/** The world and sense settings from a world file or a config; the problem lines when either is invalid. */
function worldAndSettings(parsed: SenseArgs): { world: World; settings: SenseSettings } | readonly string[] {
  try {
    if (parsed.configPath == null) return { world: loadWorld(parsed.worldPath as string), settings: DEFAULT_SENSE_SETTINGS };
    const { worldPath, senses } = configWorldAndSenses(parsed.configPath);
    return { world: loadWorld(worldPath), settings: senses };
  } catch (error) {
    if (error instanceof ConfigError) return error.lines;
    if (error instanceof WorldFileError) return [error.message];
    throw error;
  }
}

/** `crosswise sense (<world> | --config FILE) --at X,Y,HEADING [--action A] [--step N] [--json]`. */
export async function senseCommand(args: readonly string[]): Promise<number> {
  const parsed = parseArgs(args);
  if (typeof parsed === 'string') {
    console.error(`crosswise sense: ${parsed} (${USAGE})`);
    return 1;
  }
  const loaded = worldAndSettings(parsed);
  if (!('world' in loaded)) {
    for (const line of loaded) console.error(line);
    return 1;
  }
  const { world, settings } = loaded;
  const pose = parsePose(world, parsed.at);
  const report = typeof pose === 'string' ? pose : senseReport(world, pose, parsed.action, parsed.stepIndex, settings);
  if (typeof report === 'string') {
    console.error(`crosswise sense: ${report}`);
    return 1;
  }
  console.log(parsed.json ? JSON.stringify(report, null, 2) : table(report));
  return 0;
}
