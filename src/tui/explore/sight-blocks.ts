import type { SightBlock } from '../components/sight-panel.js';

const SHADES = ' ░▒▓█';

/**
 * Encodes a linear light value for display with the sRGB transfer function
 * (IEC 61966-2-1:1999): 12.92·v below 0.0031308, else 1.055·v^(1/2.4) − 0.055.
 * The senses are linear (reflectance × illumination); terminals expect encoded values.
 */
export function srgbEncode(linear: number): number {
  const v = Math.min(1, Math.max(0, Number.isFinite(linear) ? linear : 0));
  return v <= 0.0031308 ? 12.92 * v : 1.055 * v ** (1 / 2.4) - 0.055;
}

/** An ink colour string for a linear RGB triple, each channel 0..1 (clamped). */
export function inkColour(r: number, g: number, b: number): string {
  const byte = (v: number) => Math.round(srgbEncode(v) * 255);
  return `rgb(${byte(r)},${byte(g)},${byte(b)})`;
}

/**
 * A shade character for a linear RGB triple: relative luminance
 * Y = 0.2126 R + 0.7152 G + 0.0722 B (ITU-R BT.709), encoded as above, in five steps
 * from blank (dark) to a full block.
 */
export function shadeOf(r: number, g: number, b: number): string {
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  return SHADES[Math.round(srgbEncode(y) * (SHADES.length - 1))];
}

/**
 * The sight channel [depth, width, 3] (row 0 nearest) as rows of blocks `blockWidth`
 * characters wide, far row first: coloured full blocks, or shade characters without colour.
 */
export function sightBlocks(sight: Float32Array, width: number, depth: number, colour: boolean, blockWidth: number): SightBlock[][] {
  const rows: SightBlock[][] = [];
  for (let d = depth - 1; d >= 0; d--) {
    const row: SightBlock[] = [];
    for (let w = 0; w < width; w++) {
      const at = 3 * (d * width + w);
      const [r, g, b] = [sight[at], sight[at + 1], sight[at + 2]];
      row.push(colour
        ? { text: '█'.repeat(blockWidth), color: inkColour(r, g, b) }
        : { text: shadeOf(r, g, b).repeat(blockWidth) });
    }
    rows.push(row);
  }
  return rows;
}
