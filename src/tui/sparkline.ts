const LEVELS = '▁▂▃▄▅▆▇█';

/**
 * The last `width` values as a row of block heights scaled between their own minimum
 * and maximum; a flat series draws as the lowest block, a missing value as a space.
 */
export function sparkline(values: readonly number[], width: number): string {
  const shown = values.slice(Math.max(0, values.length - width));
  const finite = shown.filter(Number.isFinite);
  const lo = Math.min(...finite);
  const hi = Math.max(...finite);
  const span = hi - lo;
  return shown
    .map((v) => {
      if (!Number.isFinite(v)) return ' ';
      if (span === 0) return LEVELS[0];
      return LEVELS[Math.round(((v - lo) / span) * (LEVELS.length - 1))];
    })
    .join('');
}
