/**
 * How numbers are spelt in every CSV crosswise writes, so that pandas `read_csv` (and R's
 * `read.csv`) read them as numbers: the shortest text that reads back as the same double
 * (JavaScript's `String(x)`), `inf` and `-inf` for the infinities, and an empty field for
 * an undefined number (NaN), which pandas reads as NaN. The text `NaN` is never written.
 */
export function formatCsvNumber(x: number): string {
  if (Number.isNaN(x)) return '';
  if (x === Infinity) return 'inf';
  if (x === -Infinity) return '-inf';
  return String(x);
}

/** An optional number: empty when absent. */
export function formatOptionalNumber(x: number | null): string {
  return x == null ? '' : formatCsvNumber(x);
}

/**
 * Reads a number written by formatCsvNumber: '' is NaN, 'inf' and '-inf' are infinities.
 * Returns null for any other text that is not a finite number.
 */
export function parseCsvNumber(text: string): number | null {
  if (text === '') return NaN;
  if (text === 'inf') return Infinity;
  if (text === '-inf') return -Infinity;
  const value = Number(text);
  return text.trim() === text && Number.isFinite(value) ? value : null;
}
