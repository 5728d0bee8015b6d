import { LATENT_KIND, LATENT_NAMES, type LatentName } from '../collect/dataset.js';
import { latentClassNames } from '../collect/collector.js';
import { latentsAt } from '../collect/latents.js';
import { readWorldFile } from '../experiment/file-kind.js';
import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';
import { bandCentresHz } from '../senses/mel.js';
import { CHANNEL_UNITS, channelEntryNames, channelShape } from '../senses/registry.js';
import { senseAll } from '../senses/sense-all.js';
import { arrivalTransition } from '../world/arrival.js';
import { isBlocked } from '../world/movement.js';
import { HEADINGS, type Action, type Heading, type Pose, type World } from '../world/types.js';
import { runAction } from './command-line.js';
import { CONFIG_HINT, configWorldAndSenses } from './config-senses.js';
import { EXIT } from './exit-codes.js';
import { senseUsage } from './sense-usage.js';
import { UsageError } from './usage.js';

function parsePose(world: World, at: string): Pose | string {
  const match = /^(\d+),(\d+),([a-z]+)$/.exec(at.trim());
  if (match == null) return `--at: expected X,Y,HEADING (e.g. 2,3,north), got '${at}'`;
  const [x, y, heading] = [Number(match[1]), Number(match[2]), match[3]];
  if (!(HEADINGS as readonly string[]).includes(heading)) return `--at: heading must be one of ${HEADINGS.join(', ')}, got '${heading}'`;
  if (x >= world.width || y >= world.height) return `--at: x=${x}, y=${y} is outside the ${world.width}×${world.height} map`;
  if (isBlocked(world, x, y)) return `--at: x=${x}, y=${y} is a solid cell; the agent cannot stand there`;
  return { x, y, heading: heading as Heading };
}

/** The `crosswise sense --json` object; sight values nest as [depth][width][rgb]; `units` says what each channel's numbers measure. */
interface SenseReport {
  readonly world: string;
  readonly pose: Pose;
  readonly action: Action;
  readonly step: number;
  readonly sight: { readonly units: string; readonly shape: readonly number[]; readonly values: number[][][] };
  readonly sound: { readonly units: string; readonly bands_hz: number[]; readonly left_db: number[]; readonly right_db: number[] };
  readonly touch: { readonly units: string; readonly names: readonly string[]; readonly values: number[] };
  readonly motor: { readonly units: string; readonly names: readonly string[]; readonly values: number[] };
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
    sight: { units: CHANNEL_UNITS.sight, shape: channelShape('sight', settings), values: nest(senses.sight, channelShape('sight', settings)) as number[][][] },
    sound: {
      units: CHANNEL_UNITS.sound,
      bands_hz: [...bandCentresHz(settings)].map((f) => round(f, 1)),
      left_db: [...senses.sound.subarray(0, bands)].map((v) => round(v, 4)),
      right_db: [...senses.sound.subarray(bands)].map((v) => round(v, 4)),
    },
    touch: { units: CHANNEL_UNITS.touch, names: channelEntryNames('touch', settings), values: [...senses.touch].map((v) => round(v, 6)) },
    motor: { units: CHANNEL_UNITS.motor, names: channelEntryNames('motor', settings), values: [...senses.motor] },
    latents,
  };
}

function table(r: SenseReport): string {
  const cell = (v: number[]) => v.map((c) => c.toFixed(2)).join(' ');
  const pad = (s: string | number, n: number) => String(s).padStart(n);
  return [
    `${r.world}: x=${r.pose.x} y=${r.pose.y} facing ${r.pose.heading}, after '${r.action}', step ${r.step}`,
    `sight: ${r.sight.units}; r g b per cell, row d0 nearest, leftmost column first`,
    ...r.sight.values.map((row, d) => `  d${d}  ${row.map(cell).join(' | ')}`),
    `sound: ${r.sound.units}`,
    `  band Hz ${r.sound.bands_hz.map((f) => pad(Math.round(f), 6)).join('')}`,
    `  left    ${r.sound.left_db.map((v) => pad(v.toFixed(1), 6)).join('')}`,
    `  right   ${r.sound.right_db.map((v) => pad(v.toFixed(1), 6)).join('')}`,
    `touch: ${r.touch.units}`,
    `  ${r.touch.names.map((n, i) => `${n}=${r.touch.values[i]}`).join('  ')}`,
    `motor: ${r.motor.units}`,
    `  ${r.motor.names.map((n, i) => `${n}=${r.motor.values[i]}`).join('  ')}`,
    'latents',
    ...Object.entries(r.latents).map(([k, v]) => `  ${k.padEnd(20)}${String(v)}`),
  ].join('\n');
}

/** `crosswise sense`: every channel and latent at one pose (see sense-usage.ts). */
export async function senseCommand(args: readonly string[]): Promise<number> {
  return runAction(senseUsage, args, async ({ operands: [worldPath], values }) => {
    const { worldPath: path, senses } = values.config == null
      ? { worldPath, senses: DEFAULT_SENSE_SETTINGS }
      : configWorldAndSenses(values.config);
    const world = readWorldFile(path, CONFIG_HINT);
    const pose = parsePose(world, values.at);
    const report = typeof pose === 'string' ? pose : senseReport(world, pose, values.action, values.step, senses);
    if (typeof report === 'string') throw new UsageError(report);
    console.log(values.json ? JSON.stringify(report, null, 2) : table(report));
    return EXIT.success;
  });
}
