import { exploreSample, type ChannelNoise, type ExploreSample } from '../../noise/explore-sample.js';
import { CHANNELS } from '../../senses/channel.js';
import { TOUCH_NAMES } from '../../senses/touch.js';
import { ACTIONS, HEADINGS, type World } from '../../world/types.js';
import type { LabelledBar } from '../components/bar-list.js';
import type { MapCell } from '../components/map-panel.js';
import type { SightBlock } from '../components/sight-panel.js';
import type { TextLine } from '../components/text-panel.js';
import { cut, formatFixed, wrapItems } from '../format.js';
import { EXPLORE_KEYS, type ExploreState } from './explore-state.js';
import { placeBlocks } from './layout.js';
import { AGENT_GLYPHS, mapKeyItems, mapRows, mapWindow } from './map-view.js';
import { sightBlocks } from './sight-blocks.js';
import { soundBarRange, soundParts } from './sound-view.js';

/** The terminal's size in character cells. */
export interface TerminalSize {
  readonly columns: number;
  readonly rows: number;
}

/** One panel, ready to draw. */
export type PanelView =
  | { readonly kind: 'sight'; readonly title: string; readonly rows: readonly (readonly SightBlock[])[]; readonly agent: string }
  | { readonly kind: 'bars'; readonly title: string; readonly bars: readonly LabelledBar[] }
  | { readonly kind: 'text'; readonly title: string; readonly lines: readonly TextLine[] };

/** A column of panels right of the map. */
export interface ColumnView {
  readonly width: number;
  readonly panels: readonly PanelView[];
}

/** The whole explore screen for one state and terminal size, every line cut to fit. */
export interface ExploreView {
  readonly status: string;
  /** The replay's line under the status (where in the recording, the player), or null when exploring live. */
  readonly replay: string | null;
  /** Terminal columns of the map's column (0 when there is no room for it). */
  readonly mapWidth: number;
  readonly map: readonly (readonly MapCell[])[];
  /** The key to the map, under it; empty when it went to a column or did not fit. */
  readonly mapKey: readonly string[];
  readonly columns: readonly ColumnView[];
  readonly footer: readonly string[];
}

/** Labels of the touch and motor bars (the channel registry's entry names, as `sense` prints them) and the width of their bars. */
export const BAR_LABEL_WIDTH = Math.max(...[...TOUCH_NAMES, ...ACTIONS].map((name) => name.length));
export const BAR_WIDTH = 5;
const BAR_PANEL_WIDTH = BAR_LABEL_WIDTH + 1 + BAR_WIDTH + 1 + 4;
/** The map keeps at least this many columns (or the whole map when it is narrower). */
const MIN_MAP_COLUMNS = 20;
const TRUTH_WIDTH = 28;
/** The map's column is at least this wide when there is room, so the key under a small map wraps sensibly. */
const KEY_WIDTH = 28;
const SIGHT_MAX_COLUMNS = 28;

interface Panel {
  readonly id: string;
  readonly width: number;
  readonly view: PanelView;
  readonly follows?: string;
}

const height = (view: PanelView) => 1 + (view.kind === 'sight' ? view.rows.length + 1 : view.kind === 'bars' ? view.bars.length : view.lines.length);

/** What differs between exploring live and replaying: the keys the help lists, and the replay's line. */
export interface ScreenMode {
  readonly keys: readonly (readonly [string, string])[];
  readonly replay: string | null;
}

const LIVE: ScreenMode = { keys: EXPLORE_KEYS, replay: null };

/** The explore screen's content for a state on a terminal of the given size. */
export function exploreView(state: ExploreState, size: TerminalSize, mode: ScreenMode = LIVE): ExploreView {
  const world = state.worlds[state.worldIndex];
  const sample = exploreSample({ ...state, world });
  const footerKeys = state.help
    ? wrapItems(mode.keys.map(([key, action]) => `${key} ${action}`), size.columns)
    : ['? keys · q quit'];
  const panelRows = Math.max(1, size.rows - 1 - (mode.replay == null ? 0 : 1) - footerKeys.length);
  const panels = panelsInOrder(state, world, sample, panelRows);
  const placement = placeBlocks(panels.map((p) => ({ id: p.id, width: p.width, height: height(p.view), follows: p.follows })), {
    columns: size.columns, height: panelRows, minMapColumns: Math.min(world.width, MIN_MAP_COLUMNS), wantedMapColumns: Math.max(2 * world.width, KEY_WIDTH),
  });
  const cellWidth = placement.mapColumns >= 2 * world.width ? 2 : 1;
  const window = mapWindow(world, state.pose, Math.floor(placement.mapColumns / cellWidth), panelRows);
  const byId = new Map(panels.map((p) => [p.id, p.view]));
  const columns = placement.columns.map((c) => ({ width: c.width, height: c.height, panels: c.ids.map((id) => byId.get(id) as PanelView) }));
  const { floorDb, ceilingDb } = soundBarRange(world.ambientDb);
  const keyItems = [...mapKeyItems(world, sample, window), `sound bars ${floorDb}–${ceilingDb} dB`];
  const mapKey = wrapItems(keyItems, placement.mapColumns);
  const keyUnderMap = window.height > 0 && window.height + 1 + mapKey.length <= panelRows;
  const keyColumn = keyUnderMap ? undefined : columns.find((c) => c.height + 1 + wrapItems(keyItems, c.width).length <= panelRows);
  if (keyColumn != null) keyColumn.panels = [...keyColumn.panels, { kind: 'text', title: 'key', lines: wrapItems(keyItems, keyColumn.width).map((text) => ({ text })) }];
  const hidden = [...placement.hidden, ...(keyUnderMap || keyColumn != null ? [] : ['key'])];
  return {
    status: cut(statusLine(state, world), size.columns),
    replay: mode.replay == null ? null : cut(mode.replay, size.columns),
    mapWidth: placement.mapColumns,
    map: mapRows(world, state.pose, sample, window, cellWidth, state.colour),
    mapKey: keyUnderMap ? mapKey : [],
    columns: columns.map(({ width, panels: p }) => ({ width, panels: p })),
    footer: [...footerKeys.slice(0, -1), cut(footerKeys[footerKeys.length - 1] + (hidden.length > 0 ? ` · no room for: ${hidden.join(', ')}` : ''), size.columns)],
  };
}

function statusLine(state: ExploreState, world: World): string {
  const { pose, transition } = state;
  const turned = state.action === 'turn-left' || state.action === 'turn-right';
  const outcome = transition.bumped ? 'bumped' : transition.moved ? 'moved' : turned ? 'turned' : 'stayed';
  const noisy = CHANNELS.filter((c) => state.noise[c].severity > 0);
  return `${world.name} · step ${state.stepIndex} · x ${pose.x} y ${pose.y} facing ${pose.heading} · ${state.action}: ${outcome}`
    + (noisy.length > 0 ? ` · noisy: ${noisy.join(', ')}` : '');
}

/** Every panel, most important first; the ground truth only when asked for. */
function panelsInOrder(state: ExploreState, world: World, sample: ExploreSample, rows: number): Panel[] {
  const sound = soundParts(sample.senses.sound, sample.bandsHz, world.ambientDb, rows);
  const noise = CHANNELS.map((c) => ({ text: `${c === state.noiseChannel ? '>' : ' '} ${c.padEnd(5)} ${noiseText(state.noise[c], sample.noiseParameter[c])}`, bold: c === state.noiseChannel }));
  const truth = state.latents ? truthLines(world, sample) : null;
  return [
    sightPanel(state, sample, rows),
    ...sound.map((part, i) => ({
      id: soundId(i), follows: i === 0 ? undefined : soundId(i - 1), width: part.title.length,
      view: { kind: 'text' as const, title: part.title, lines: part.lines.map((text) => ({ text })) },
    })),
    { id: 'touch', width: BAR_PANEL_WIDTH, view: { kind: 'bars', title: 'touch', bars: TOUCH_NAMES.map((name, i) => bar(name, sample.senses.touch[i])) } },
    ...(truth == null ? [] : [{ id: 'ground truth', width: TRUTH_WIDTH, view: { kind: 'text' as const, title: 'ground truth', lines: truth.map((text) => ({ text: cut(text, TRUTH_WIDTH) })) } }]),
    { id: 'noise', width: Math.max(...noise.map((n) => n.text.length)), view: { kind: 'text', title: 'noise · n k + -', lines: noise } },
    { id: 'motor', width: BAR_PANEL_WIDTH, view: { kind: 'bars', title: 'motor · last command', bars: ACTIONS.map((action, i) => bar(action, sample.senses.motor[i])) } },
  ];
}

const soundId = (part: number) => (part === 0 ? 'sound' : `sound ${part + 1}`);

/** The egocentric view with the agent under its middle column; far rows are dropped when the terminal is too short. */
function sightPanel(state: ExploreState, sample: ExploreSample, rows: number): Panel {
  const { width, depth } = state.settings.sight;
  const blockWidth = [4, 2, 1].find((w) => w * width <= SIGHT_MAX_COLUMNS) ?? 1;
  const blocks = sightBlocks(sample.senses.sight, width, depth, state.colour, blockWidth);
  const title = 'sight · ahead is up';
  const shown = blocks.slice(Math.max(0, blocks.length - Math.max(1, rows - 2)));
  const middle = Math.floor(width / 2) * blockWidth + Math.floor((blockWidth - 1) / 2);
  return {
    id: 'sight',
    width: Math.max(title.length, width * blockWidth),
    view: { kind: 'sight', title, rows: shown, agent: ' '.repeat(middle) + AGENT_GLYPHS.north },
  };
}

function bar(label: string, value: number): LabelledBar {
  return { label, fraction: value, value: formatFixed(value, 2) };
}

function noiseText(noise: ChannelNoise, parameter: number): string {
  if (noise.severity === 0) return `${noise.kind} 0 clean`;
  const detail = { gaussian: `σ ${parameter}`, dropout: `p ${parameter}`, blackout: `p ${parameter}`, masking: `SNR ${parameter}dB` }[noise.kind];
  return `${noise.kind} ${noise.severity} ${detail}`;
}

function truthLines(world: World, sample: ExploreSample): string[] {
  const t = sample.latents;
  const material = (i: number) => world.materials[i].name;
  const azimuth = Math.round(t.nearest_azimuth_deg);
  const side = azimuth === 0 ? 'ahead' : Math.abs(azimuth) === 180 ? 'behind' : azimuth > 0 ? 'right' : 'left';
  return [
    `x ${t.x} y ${t.y} ${HEADINGS[t.heading]}`,
    `under ${material(t.material_under)}`,
    `ahead ${material(t.material_ahead)}${t.wall_ahead === 1 ? ' wall' : ''}`,
    `nearest ${world.emitters[t.nearest_emitter].name}`,
    `${t.nearest_distance_m.toFixed(1)} m at ${azimuth > 0 ? '+' : ''}${azimuth}° (${side})`,
    `emitter in view ${t.emitter_in_view === 1 ? 'yes' : 'no'}`,
  ];
}
