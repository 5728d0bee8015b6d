import type { Heading } from '../world/types.js';

/** Index of a heading in HEADINGS order (0 north, 1 east, 2 south, 3 west). */
export const HEADING_INDEX: Readonly<Record<Heading, number>> = { north: 0, east: 1, south: 2, west: 3 };
