import { latentsAt } from '../../collect/latents.js';
import { severityParameter } from '../../noise/severity.js';
import { bandCentresHz } from '../../senses/mel.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS } from '../../senses/channel.js';
import { sceneFor } from '../../senses/scene.js';
import { TOUCH_NAMES } from '../../senses/touch.js';
import { visibleCell } from '../../senses/sight.js';
import { ACTIONS, HEADINGS, type Heading, type World } from '../../world/types.js';
import { emitterIsOn } from '../../world/emitter.js';
import type { LabelledBar } from '../components/bar-list.js';
import type { MapCell } from '../components/map-panel.js';
import type { SightBlock } from '../components/sight-panel.js';
import type { SoundPanelProps } from '../components/sound-panel.js';
import { formatFixed, formatHz } from '../format.js';
import type { ChannelNoise, ExploreState } from './explore-state.js';
import { noisySenses } from './noisy-senses.js';
import { inkColour, sightBlocks } from './sight-blocks.js';

/** Every panel's props for one explore state, already formatted. */
export interface ExploreView {
  readonly status: string;
  readonly map: readonly (readonly MapCell[])[];
  readonly legend: readonly string[];
  readonly sight: { readonly title: string; readonly rows: readonly (readonly SightBlock[])[] };
  readonly sound: SoundPanelProps;
  readonly touch: readonly LabelledBar[];
  readonly motor: readonly LabelledBar[];
  readonly noise: readonly { readonly text: string; readonly selected: boolean }[];
  readonly truth: readonly string[] | null;
  readonly help: boolean;
}

const SETTINGS = DEFAULT_SENSE_SETTINGS;
const ARROWS: Readonly<Record<Heading, string>> = { north: '^', east: '>', south: 'v', west: '<' };
const DB_SPAN = 60;

/** The explore screen's content for a state. */
export function exploreView(state: ExploreState): ExploreView {
  const world = state.worlds[state.worldIndex];
  const senses = noisySenses(state);
  const { pose, transition } = state;
  const outcome = transition.bumped ? 'bumped' : transition.moved ? 'moved' : 'stayed';
  const noisy = CHANNELS.filter((c) => state.noise[c].severity > 0);
  return {
    status: `${world.name} · step ${state.stepIndex} · x ${pose.x} y ${pose.y} facing ${pose.heading} · ${state.action}: ${outcome}`
      + (noisy.length > 0 ? ` · noisy: ${noisy.join(', ')}` : ''),
    map: mapCells(state, world),
    legend: legend(world, state.stepIndex),
    sight: { title: 'sight · far row on top', rows: sightBlocks(senses.sight, SETTINGS.sight.width, SETTINGS.sight.depth, state.colour) },
    sound: soundProps(senses.sound, world),
    touch: TOUCH_NAMES.map((name, i) => bar(touchLabel(name), senses.touch[i])),
    motor: ACTIONS.map((action, i) => bar(action, senses.motor[i])),
    noise: CHANNELS.map((c) => ({ text: `${c.padEnd(5)} ${noiseText(state.noise[c])}`, selected: c === state.noiseChannel })),
    truth: state.latents ? truthLines(state, world) : null,
    help: state.help,
  };
}

function bar(label: string, value: number): LabelledBar {
  return { label, fraction: value, value: formatFixed(value, 2) };
}

function touchLabel(name: string): string {
  const footfall = /^footfall_(\d+)$/.exec(name);
  if (footfall != null) return `footfall ${Number(footfall[1]) + 1}`;
  const whisker = /^whisker_(\w)/.exec(name);
  if (whisker != null) return `whisker ${whisker[1].toUpperCase()}`;
  return name === 'bump_force' ? 'bump' : name;
}

function noiseText(noise: ChannelNoise): string {
  if (noise.severity === 0) return `${noise.kind} 0 clean`;
  const p = severityParameter(noise.kind, noise.severity);
  const detail = { gaussian: `σ ${p}`, dropout: `p ${p}`, blackout: `p ${p}`, masking: `SNR ${p}dB` }[noise.kind];
  return `${noise.kind} ${noise.severity} ${detail}`;
}

function mapCells(state: ExploreState, world: World): MapCell[][] {
  const scene = sceneFor(world, SETTINGS);
  const seen = new Set<number>();
  for (let k = 0; k < SETTINGS.sight.width * SETTINGS.sight.depth; k++) seen.add(visibleCell(scene, state.pose, k));
  const rows: MapCell[][] = [];
  for (let y = 0; y < world.height; y++) {
    const row: MapCell[] = [];
    for (let x = 0; x < world.width; x++) {
      const i = y * world.width + x;
      const e = world.emitterAt[i];
      const material = world.materials[world.material[i]];
      const color = state.colour ? inkColour(...(e >= 0 ? world.emitters[e].colour : material.colour)) : undefined;
      if (x === state.pose.x && y === state.pose.y) row.push({ glyph: ARROWS[state.pose.heading], mark: 'agent' });
      else if (e >= 0) row.push({ glyph: world.emitters[e].glyph, mark: emitterIsOn(world.emitters[e], state.stepIndex) ? 'sounding' : 'silent', color });
      else row.push({ glyph: material.glyph, mark: seen.has(i) ? 'view' : 'plain', color });
    }
    rows.push(row);
  }
  return rows;
}

function legend(world: World, stepIndex: number): string[] {
  return [
    `${HEADINGS.map((h) => ARROWS[h]).join('')} you · reverse: in view`,
    ...world.emitters.map((e) => `${e.glyph} ${e.name} ${emitterIsOn(e, stepIndex) ? 'sounding' : 'silent'}`),
  ];
}

function soundProps(sound: Float32Array, world: World): SoundPanelProps {
  const bands = SETTINGS.sound.bands;
  const floorDb = Math.floor(world.ambientDb / 10) * 10;
  return {
    title: `sound · dB ${floorDb}–${floorDb + DB_SPAN} per column · Hz`,
    bandLabels: [...bandCentresHz(SETTINGS)].map(formatHz),
    leftDb: [...sound.subarray(0, bands)],
    rightDb: [...sound.subarray(bands, 2 * bands)],
    floorDb,
    ceilingDb: floorDb + DB_SPAN,
    height: 2,
  };
}

function truthLines(state: ExploreState, world: World): string[] {
  const t = latentsAt(world, state.pose, state.transition, SETTINGS);
  const material = (i: number) => world.materials[i].name;
  const yes = (v: number) => (v === 1 ? 'yes' : 'no');
  const azimuth = Math.round(t.nearest_azimuth_deg);
  const nearest = world.emitters.length === 0
    ? 'no emitters'
    : `nearest ${world.emitters[t.nearest_emitter].name} ${t.nearest_distance_m.toFixed(1)} m at ${azimuth > 0 ? '+' : ''}${azimuth}°`;
  return [
    'ground truth',
    `x ${t.x} y ${t.y} ${HEADINGS[t.heading]}`,
    `under ${material(t.material_under)}`,
    `ahead ${material(t.material_ahead)}${t.wall_ahead === 1 ? ' wall' : ''}`,
    nearest,
    `emitter in view ${yes(t.emitter_in_view)}`,
    `moved ${yes(t.moved)} bumped ${yes(t.bumped)}`,
  ];
}
