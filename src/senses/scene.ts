import { poseCount } from '../world/heading.js';
import type { World } from '../world/types.js';
import { dbToPower, spectrumShapeDb, THUD } from './acoustics.js';
import { DEFAULT_SENSE_SETTINGS, type ChannelName, type SenseSettings } from './channel.js';
import { channelSize } from './registry.js';
import { bandCentresHz } from './mel.js';
import { buildSightRays, illumination, type SightRays } from './sight-rays.js';
import { FarEarGains, soundCellTable } from './sound-table.js';

/**
 * Everything about a world and sense settings that does not change from step to step,
 * computed once so that sensing a step allocates nothing but its output rows.
 */
export interface SensoryScene {
  readonly world: World;
  readonly settings: SenseSettings;
  readonly bandsHz: Float64Array; // [bands]
  readonly ambientPower: number; // power per band, both ears
  readonly emitterPower1m: Float64Array; // [emitters, bands] power at 1 m
  /** The far ear's head-shadow gains by source offset (sound-table.ts). */
  readonly farEar: FarEarGains;
  readonly footstepPower: Float32Array; // [materials, bands] at the ears
  readonly thudPower: Float32Array; // [bands] at the ears
  readonly cellColour: Float32Array; // [cells, 3] what the eye sees at each cell
  readonly rays: readonly SightRays[]; // one per heading
  readonly light: Float32Array; // [depth, width]
  /** Numbers per step of each channel (registry.ts). */
  readonly sizes: Readonly<Record<ChannelName, number>>;
  /** Per-cell sound tables, built on the agent's first visit to a cell (float32: 2.3 kB per cell for 6 emitters, 16 bands). */
  readonly soundCells: (Float32Array | undefined)[];
  /** Scratch sum of powers [2, bands] for one step, reused so sensing allocates nothing. */
  readonly power: Float64Array;
  /** Per pose (world/heading.ts poseIndex) the map cell seen at each sight-field cell or −1 (sight.ts), built on first use. */
  readonly viewCells: (Int32Array | undefined)[];
}

function checkSettings(settings: SenseSettings): void {
  const { width, depth } = settings.sight;
  const { bands, minHz, maxHz } = settings.sound;
  const whole = (n: number) => Number.isInteger(n) && n >= 1;
  if (!whole(width) || !whole(depth)) throw new Error(`sight width and depth must be whole numbers >= 1, got ${width}×${depth}`);
  if (!whole(bands)) throw new Error(`sound bands must be a whole number >= 1, got ${bands}`);
  if (!(minHz > 0 && maxHz > minHz)) throw new Error(`sound needs 0 < min_hz < max_hz, got ${minHz} and ${maxHz}`);
}

function bandPowers(levelDb: number, band: Parameters<typeof spectrumShapeDb>[0], bandsHz: Float64Array, out: Float32Array | Float64Array, at: number): void {
  for (let b = 0; b < bandsHz.length; b++) out[at + b] = dbToPower(levelDb + spectrumShapeDb(band, bandsHz[b]));
}

function colours(world: World): Float32Array {
  const colour = new Float32Array(world.width * world.height * 3);
  for (let i = 0; i < world.width * world.height; i++) {
    const e = world.emitterAt[i];
    colour.set(e >= 0 ? world.emitters[e].colour : world.materials[world.material[i]].colour, 3 * i);
  }
  return colour;
}

/** Builds the precomputed tables for sensing `world` with `settings`. */
export function createScene(world: World, settings: SenseSettings = DEFAULT_SENSE_SETTINGS): SensoryScene {
  checkSettings(settings);
  const bandsHz = bandCentresHz(settings);
  const bands = bandsHz.length;
  const emitterPower1m = new Float64Array(world.emitters.length * bands);
  world.emitters.forEach((e, i) => bandPowers(e.levelDb, e, bandsHz, emitterPower1m, i * bands));
  const footstepPower = new Float32Array(world.materials.length * bands);
  world.materials.forEach((m, i) => { if (m.footstep != null) bandPowers(m.footstep.levelDb, m.footstep, bandsHz, footstepPower, i * bands); });
  const thudPower = new Float32Array(bands);
  bandPowers(THUD.levelDb, THUD, bandsHz, thudPower, 0);
  const { width, depth } = settings.sight;
  return {
    world, settings, bandsHz, ambientPower: dbToPower(world.ambientDb), emitterPower1m,
    farEar: new FarEarGains(bandsHz, world.height), footstepPower, thudPower,
    cellColour: colours(world), rays: buildSightRays(width, depth), light: illumination(width, depth),
    sizes: { sight: channelSize('sight', settings), sound: channelSize('sound', settings), touch: channelSize('touch', settings), motor: channelSize('motor', settings) },
    soundCells: new Array(world.width * world.height),
    viewCells: new Array(poseCount(world.width, world.height)),
    power: new Float64Array(2 * bands),
  };
}

/** The sound table of cell i (see sound-table.ts), built on first use. */
export function soundTableAt(scene: SensoryScene, cell: number): Float32Array {
  return (scene.soundCells[cell] ??= soundCellTable(scene.world, scene.emitterPower1m, scene.farEar, cell));
}

const scenes = new WeakMap<World, Map<string, SensoryScene>>();

/** The scene for a world and settings, built once and reused (keyed by the settings' values). */
export function sceneFor(world: World, settings: SenseSettings = DEFAULT_SENSE_SETTINGS): SensoryScene {
  const key = JSON.stringify(settings);
  let byWorld = scenes.get(world);
  if (byWorld == null) scenes.set(world, (byWorld = new Map()));
  let scene = byWorld.get(key);
  if (scene == null) byWorld.set(key, (scene = createScene(world, settings)));
  return scene;
}
