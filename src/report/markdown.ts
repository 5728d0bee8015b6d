import type { Summary } from '../stats/summarise.js';

/** A number with fixed decimals, or 'n/a' when undefined; a value that rounds to zero has no minus sign. */
export function num(x: number, digits = 3): string {
  return Number.isFinite(x) ? x.toFixed(digits).replace(/^-(?=0\.?0*$)/, '') : 'n/a';
}

/** A signed number with fixed decimals ('+0.012', '-0.300', '+0.000'), or 'n/a'. */
export function signed(x: number, digits = 3): string {
  const text = num(x, digits);
  return text === 'n/a' || text.startsWith('-') ? text : `+${text}`;
}

/** A p-value: three decimals, '<0.001' below that, 'n/a' when undefined. */
export function pValue(p: number): string {
  return Number.isNaN(p) ? 'n/a' : p < 0.001 ? '<0.001' : p.toFixed(3);
}

/** Mean ± half-width of the 95% CI with the number of seeds: '0.812 ± 0.034 (n=3)'. */
export function meanCi(s: Summary): string {
  if (s.n === 0) return 'n/a';
  if (s.n === 1) return `${num(s.mean)} (n=1)`;
  return `${num(s.mean)} ± ${num((s.ciHigh - s.ciLow) / 2)} (n=${s.n})`;
}

/** A Markdown pipe table; pipes and line breaks inside cells are escaped. */
export function table(header: readonly string[], rows: readonly (readonly string[])[]): string[] {
  const cell = (s: string): string => s.replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');
  const line = (cells: readonly string[]): string => `| ${cells.map(cell).join(' | ')} |`;
  return [line(header), line(header.map(() => '---')), ...rows.map(line)];
}

/** A list in plain English: 'a', 'a and b', 'a, b and c'. */
export function englishList(items: readonly string[]): string {
  return items.length <= 1 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}
