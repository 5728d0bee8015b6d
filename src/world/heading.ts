import { HEADINGS, type Heading, type Pose } from './types.js';

/**
 * Index of each heading in HEADINGS order (0 north, 1 east, 2 south, 3 west): the class
 * index of the heading latent and the key of every per-heading table.
 */
export const HEADING_INDEX: Readonly<Record<Heading, number>> = Object.fromEntries(HEADINGS.map((h, i) => [h, i])) as Record<Heading, number>;

/** Forward (fx, fy) and right (rx, ry) unit vectors of a heading, in map cells. */
export interface HeadingFrame {
  readonly fx: number;
  readonly fy: number;
  readonly rx: number;
  readonly ry: number;
}

// y grows southwards (down the map), so north is (0, −1) and right is forward turned clockwise: (−fy, fx).
const FRAMES: Readonly<Record<Heading, HeadingFrame>> = {
  north: { fx: 0, fy: -1, rx: 1, ry: 0 },
  east: { fx: 1, fy: 0, rx: 0, ry: 1 },
  south: { fx: 0, fy: 1, rx: -1, ry: 0 },
  west: { fx: -1, fy: 0, rx: 0, ry: -1 },
};

/** The forward and right vectors of a heading. */
export function headingFrame(heading: Heading): HeadingFrame {
  return FRAMES[heading];
}

/** The heading after a quarter turn to the left. */
export function leftOf(heading: Heading): Heading {
  return HEADINGS[(HEADING_INDEX[heading] + 3) % 4];
}

/** The heading after a quarter turn to the right. */
export function rightOf(heading: Heading): Heading {
  return HEADINGS[(HEADING_INDEX[heading] + 1) % 4];
}

/** Number of poses of a world: every cell in every heading. */
export function poseCount(width: number, height: number): number {
  return width * height * HEADINGS.length;
}

/** Index of a pose among poseCount: (y · width + x) · 4 + heading index, so a cell's four headings are adjacent. */
export function poseIndex(width: number, pose: Pose): number {
  return (pose.y * width + pose.x) * HEADINGS.length + HEADING_INDEX[pose.heading];
}
