import type { ExploreSample } from '../../noise/explore-sample.js';
import { HEADINGS, type Heading, type Pose, type World } from '../../world/types.js';
import type { MapCell } from '../components/map-panel.js';
import { inkColour } from './sight-blocks.js';

/**
 * The agent as a circle dark on the side it faces: a head turned that way. Cells it sees
 * are underlined, as if lit by its lamp.
 */
export const AGENT_GLYPHS: Readonly<Record<Heading, string>> = { north: '◓', east: '◑', south: '◒', west: '◐' };

/** The part of the map on screen: first column and row, and its size in cells. */
export interface MapWindow {
  readonly x0: number;
  readonly y0: number;
  readonly width: number;
  readonly height: number;
}

/** The first cell of a window of `size` cells centred on `at` and kept inside 0..extent. */
function windowStart(at: number, size: number, extent: number): number {
  return Math.max(0, Math.min(at - Math.floor(size / 2), extent - size));
}

/** The largest window of at most `width` × `height` cells, centred on the agent but inside the map. */
export function mapWindow(world: World, pose: Pose, width: number, height: number): MapWindow {
  const w = Math.max(0, Math.min(width, world.width));
  const h = Math.max(0, Math.min(height, world.height));
  return { x0: windowStart(pose.x, w, world.width), y0: windowStart(pose.y, h, world.height), width: w, height: h };
}

/**
 * The map cells of a window. With two characters per cell, solid cells repeat their glyph
 * and open cells are followed by a space, so walls read as walls and floors stay sparse.
 */
export function mapRows(
  world: World, pose: Pose, sample: ExploreSample, window: MapWindow, cellWidth: 1 | 2, colour: boolean,
): MapCell[][] {
  const rows: MapCell[][] = [];
  for (let y = window.y0; y < window.y0 + window.height; y++) {
    const row: MapCell[] = [];
    for (let x = window.x0; x < window.x0 + window.width; x++) row.push(mapCell(world, pose, sample, x, y, cellWidth, colour));
    rows.push(row);
  }
  return rows;
}

function mapCell(world: World, pose: Pose, sample: ExploreSample, x: number, y: number, cellWidth: 1 | 2, colour: boolean): MapCell {
  const i = y * world.width + x;
  const widen = (glyph: string, solid: boolean) => (cellWidth === 1 ? glyph : solid ? glyph + glyph : `${glyph} `);
  if (x === pose.x && y === pose.y) return { text: widen(AGENT_GLYPHS[pose.heading], false), bold: true };
  const e = world.emitterAt[i];
  const underline = sample.cellsInView.has(i);
  if (e >= 0) {
    const emitter = world.emitters[e];
    const color = colour ? inkColour(...emitter.colour) : undefined;
    return { text: widen(emitter.glyph, emitter.solid), color, bold: sample.sounding[e], dim: !sample.sounding[e], underline };
  }
  const material = world.materials[world.material[i]];
  return { text: widen(material.glyph, material.solid), color: colour ? inkColour(...material.colour) : undefined, underline };
}

/**
 * The key to the map as short items: the agent's glyphs, the mark of cells in view, the
 * window when the map is cropped, every material, and every emitter with whether it is on.
 */
export function mapKeyItems(world: World, sample: ExploreSample, window: MapWindow): string[] {
  const cropped = window.width < world.width || window.height < world.height;
  return [
    `${HEADINGS.map((h) => AGENT_GLYPHS[h]).join('')} you`,
    'underlined: seen',
    ...(cropped ? [`x ${window.x0}–${window.x0 + window.width - 1} y ${window.y0}–${window.y0 + window.height - 1} of ${world.width}×${world.height}`] : []),
    ...world.materials.map((m) => `${m.glyph} ${m.name}`),
    ...world.emitters.map((e, i) => `${e.glyph} ${e.name} (${sample.sounding[i] ? 'on' : 'off'})`),
  ];
}
