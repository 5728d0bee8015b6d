/**
 * Calls `visit` for each grid cell strictly between (x0, y0) and (x1, y1) on the digital
 * straight line of Bresenham (1965), "Algorithm for computer control of a digital plotter",
 * IBM Systems Journal 4(1). Stops early and returns false when `visit` returns false.
 *
 * The line is drawn from the first point towards the second, so the cells between two
 * points can differ slightly with the direction; callers always draw from the agent.
 */
export function forEachCellBetween(
  x0: number, y0: number, x1: number, y1: number, visit: (x: number, y: number) => boolean,
): boolean {
  if (x0 === x1 && y0 === y1) return true;
  const dx = Math.abs(x1 - x0);
  const dy = -Math.abs(y1 - y0);
  const sx = x0 < x1 ? 1 : -1;
  const sy = y0 < y1 ? 1 : -1;
  let error = dx + dy;
  let x = x0;
  let y = y0;
  for (;;) {
    const twice = 2 * error;
    if (twice >= dy) { error += dy; x += sx; }
    if (twice <= dx) { error += dx; y += sy; }
    if (x === x1 && y === y1) return true;
    if (!visit(x, y)) return false;
  }
}

/** The number of solid cells strictly between two cells on their Bresenham line. */
export function solidCellsBetween(
  solid: Uint8Array, width: number, x0: number, y0: number, x1: number, y1: number,
): number {
  let count = 0;
  forEachCellBetween(x0, y0, x1, y1, (x, y) => {
    count += solid[y * width + x];
    return true;
  });
  return count;
}
