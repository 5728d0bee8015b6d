/** Quotes one CSV field when it holds a comma, quote, CR or LF (RFC 4180, section 2). */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** One CSV record terminated by LF. */
export function csvLine(fields: readonly string[]): string {
  return fields.map(csvField).join(',') + '\n';
}

/** A parsed record with the 1-based line number where it starts. */
export interface CsvRecord {
  readonly line: number;
  readonly fields: string[];
}

/**
 * Splits CSV text into records (RFC 4180: quoted fields may hold commas, doubled
 * quotes and line breaks; CRLF or LF line ends). Blank lines are skipped.
 */
export function parseCsv(text: string, fileName: string): CsvRecord[] {
  const records: CsvRecord[] = [];
  let fields: string[] = [];
  let field = '';
  let quoted = false;
  let line = 1;
  let start = 1;
  let touched = false;
  const endRecord = (): void => {
    fields.push(field);
    if (touched || fields.length > 1 || field !== '') records.push({ line: start, fields });
    fields = [];
    field = '';
    touched = false;
  };
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') { field += '"'; i++; }
      else if (c === '"') quoted = false;
      else { if (c === '\n') line++; field += c; }
    } else if (c === '"' && field === '') { quoted = true; touched = true; }
    else if (c === ',') { fields.push(field); field = ''; touched = true; }
    else if (c === '\n' || c === '\r') {
      if (c === '\r' && text[i + 1] === '\n') i++;
      endRecord();
      line++;
      start = line;
    } else field += c;
  }
  if (quoted) throw new Error(`${fileName}:${start}: unterminated quoted field`);
  if (field !== '' || fields.length > 0 || touched) endRecord();
  return records;
}
