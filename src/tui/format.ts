/** Short text forms of numbers and durations for the terminal screens. */

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

/** `text` cut to `width` characters, its last one an ellipsis when something was cut. */
export function cut(text: string, width: number): string {
  if (text.length <= width) return text;
  return width <= 0 ? '' : `${text.slice(0, width - 1)}…`;
}

/** Items joined by `separator` into as few lines of at most `width` characters as fit; an over-long item is cut. */
export function wrapItems(items: readonly string[], width: number, separator = '  '): string[] {
  const lines: string[] = [];
  for (const item of items) {
    const last = lines.length - 1;
    if (last >= 0 && lines[last].length + separator.length + item.length <= width) lines[last] += separator + item;
    else lines.push(cut(item, width));
  }
  return lines;
}

/**
 * A bar `width` cells long for `fraction` in 0..1 in half-cell steps, growing to the right
 * or, mirrored, to the left (there is no left-aligned eighth block, so halves keep both
 * directions at one resolution); values outside 0..1 are clamped.
 */
export function halfBar(fraction: number, width: number, direction: 'right' | 'left'): string {
  const f = Number.isFinite(fraction) ? Math.min(1, Math.max(0, fraction)) : 0;
  const halves = Math.round(f * width * 2);
  const full = '█'.repeat(Math.floor(halves / 2));
  if (direction === 'right') return (full + (halves % 2 === 1 ? '▌' : '')).padEnd(width, ' ');
  return ((halves % 2 === 1 ? '▐' : '') + full).padStart(width, ' ');
}
