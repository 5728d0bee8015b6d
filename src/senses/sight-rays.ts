import { headingFrame, type HeadingFrame } from '../world/heading.js';
import { forEachCellBetween } from '../world/line.js';
import { HEADINGS } from '../world/types.js';

/**
 * The sight field's geometry for one heading, relative to the agent: where each field cell
 * lies and which cells a line of sight to it crosses. Field cell k = d · width + w, row d
 * (0 nearest, d + 1 cells ahead), column w (0 leftmost as the agent sees it, lateral offset
 * w − floor(width / 2) cells to the right, so an even width has one extra column on the left).
 */
export interface SightRays {
  readonly targetDx: Int32Array; // [cells]
  readonly targetDy: Int32Array; // [cells]
  /** Cells strictly between agent and field cell k are between[start[k] .. start[k + 1]). */
  readonly start: Int32Array; // [cells + 1]
  readonly betweenDx: Int32Array;
  readonly betweenDy: Int32Array;
}

function raysFor({ fx, fy, rx, ry }: HeadingFrame, width: number, depth: number): SightRays {
  const cells = width * depth;
  const targetDx = new Int32Array(cells);
  const targetDy = new Int32Array(cells);
  const start = new Int32Array(cells + 1);
  const dxs: number[] = [];
  const dys: number[] = [];
  for (let d = 0; d < depth; d++) {
    for (let w = 0; w < width; w++) {
      const k = d * width + w;
      const ahead = d + 1;
      const lateral = w - Math.floor(width / 2);
      targetDx[k] = ahead * fx + lateral * rx;
      targetDy[k] = ahead * fy + lateral * ry;
      start[k] = dxs.length;
      forEachCellBetween(0, 0, targetDx[k], targetDy[k], (x, y) => { dxs.push(x); dys.push(y); return true; });
    }
  }
  start[cells] = dxs.length;
  return { targetDx, targetDy, start, betweenDx: Int32Array.from(dxs), betweenDy: Int32Array.from(dys) };
}

/** Sight rays for every heading, in HEADINGS order. */
export function buildSightRays(width: number, depth: number): readonly SightRays[] {
  return HEADINGS.map((h) => raysFor(headingFrame(h), width, depth));
}

/**
 * Illumination of each field cell by a lamp carried at the agent: the inverse-square law
 * for a point source (e.g. Ryer 1997, The Light Measurement Handbook, §4), 1 / r² with r
 * the distance in cells between centres, so the nearest cell straight ahead gets 1.
 */
export function illumination(width: number, depth: number): Float32Array {
  const light = new Float32Array(width * depth); // [depth, width]
  for (let d = 0; d < depth; d++) {
    for (let w = 0; w < width; w++) {
      const lateral = w - Math.floor(width / 2);
      light[d * width + w] = 1 / ((d + 1) ** 2 + lateral ** 2);
    }
  }
  return light;
}
