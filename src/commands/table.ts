/** Left-aligned text columns separated by two spaces, without trailing spaces. */
export function formatTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  // A loop, not Math.max(...spread): spreading one argument per row overflows the stack on long tables.
  const widths = header.map((title, i) => rows.reduce((width, row) => Math.max(width, row[i].length), title.length));
  const line = (cells: readonly string[]) => cells.map((cell, i) => cell.padEnd(widths[i])).join('  ').trimEnd();
  return [line(header), ...rows.map(line)].join('\n');
}
