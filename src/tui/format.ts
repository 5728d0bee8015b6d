/** Short text forms of numbers and durations for the terminal screens. */

const EIGHTHS = ' ▁▂▃▄▅▆▇█';

/** A duration as `45s`, `3m12s` or `1h04m`; `--` when unknown. */
export function formatDuration(seconds: number | null): string {
  if (seconds == null || !Number.isFinite(seconds) || seconds < 0) return '--';
  const s = Math.round(seconds);
  if (s < 60) return `${s}s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m}m${String(s % 60).padStart(2, '0')}s`;
  return `${Math.floor(m / 60)}h${String(m % 60).padStart(2, '0')}m`;
}

/** A number with a fixed count of decimals, or `--` for NaN and infinities. */
export function formatFixed(value: number, decimals: number): string {
  return Number.isFinite(value) ? value.toFixed(decimals) : '--';
}

/** A mean, followed by `±half` when a confidence half-width is known. */
export function formatMeanCi(mean: number, halfWidth: number | null, decimals = 2): string {
  const m = formatFixed(mean, decimals);
  return halfWidth == null || !Number.isFinite(halfWidth) ? m : `${m}±${halfWidth.toFixed(decimals)}`;
}

/** A frequency as `440`, `1.2k` or `12k` (Hz implied), at most four characters. */
export function formatHz(hz: number): string {
  if (hz < 1000) return String(Math.round(hz));
  const k = hz / 1000;
  return k < 9.95 ? `${k.toFixed(1)}k` : `${Math.round(k)}k`;
}

/**
 * A horizontal bar of `width` cells for `fraction` in 0..1, drawn with eighth blocks so
 * the length resolves 8 steps per cell; values outside 0..1 are clamped.
 */
export function horizontalBar(fraction: number, width: number): string {
  const f = Number.isFinite(fraction) ? Math.min(1, Math.max(0, fraction)) : 0;
  const eighths = Math.round(f * width * 8);
  const full = Math.floor(eighths / 8);
  const part = eighths % 8;
  const partial = part > 0 ? '▏▎▍▌▋▊▉'[part - 1] : '';
  return ('█'.repeat(full) + partial).padEnd(width, ' ');
}

/**
 * One character of a column `rows` tall, for row `row` counted from the bottom (0),
 * of a vertical bar filled to `fraction` of its height with eighth blocks.
 */
export function verticalBarCell(fraction: number, row: number, rows: number): string {
  const f = Number.isFinite(fraction) ? Math.min(1, Math.max(0, fraction)) : 0;
  const eighths = Math.round(f * rows * 8) - row * 8;
  return EIGHTHS[Math.min(8, Math.max(0, eighths))];
}
