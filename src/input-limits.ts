import { statSync } from 'node:fs';
import { CST, Lexer } from 'yaml';

/**
 * What crosswise reads at most, so a hostile or mistaken file fails at once with one
 * located line instead of exhausting time, memory or the stack. Checked before a file is
 * parsed or a sweep expanded. README ("Limits") states the same numbers.
 */
export const INPUT_LIMITS = {
  /** Bytes of a config file (a large sweep config is a few kB). */
  configBytes: 256 * 1024,
  /** Bytes of a world file (a 256 × 256 map is 66 kB of text). */
  worldBytes: 1024 * 1024,
  /** Levels of nested YAML collections, block and flow together. */
  nesting: 64,
  /** Nodes one YAML alias may bring in when expanded (the `yaml` package's maxAliasCount). */
  aliasNodes: 100,
  /** Cells in one sweep: vary combinations × seeds × learners. */
  sweepCells: 10_000,
} as const;

/** Text as one line whatever a file held: line breaks and other control characters are escaped as in JSON. */
export function oneLine(text: string): string {
  // eslint-disable-next-line no-control-regex -- control characters are exactly what is matched
  return text.replace(/[\u0000-\u001f\u007f]/g, (c) => JSON.stringify(c).slice(1, -1));
}

/**
 * Why a file is too large to read, as one `path:1:1: ...` line, or null when it is small
 * enough. Asks the file system first, so a huge file is refused before it is read.
 */
export function fileSizeProblem(path: string, maxBytes: number, what: string): string | null {
  let bytes: number;
  try {
    bytes = statSync(path).size;
  } catch {
    return null; // the read that follows reports a missing or unreadable file
  }
  return bytes <= maxBytes ? null : `${path}:1:1: the ${what} is ${bytes} bytes; at most ${maxBytes} are read (see "Limits" in the README)`;
}

/**
 * Where YAML text nests deeper than INPUT_LIMITS.nesting, as one `path:line:col: ...`
 * line, or null. One pass over the lexer's tokens, without parsing: the parser recurses
 * once per level, and a few hundred thousand levels exhaust its stack and then the heap.
 * Block levels are counted by the indentation columns open at each line's first item
 * (and at each `-` or `?` on it), flow levels by open brackets.
 */
export function yamlNestingProblem(text: string, path: string): string | null {
  const blockColumns: number[] = []; // indentation of each open block collection
  let flow = 0;
  let offset = 0;
  let lineStart = 0;
  let atLineStart = true;
  let scalarFollows = false;
  for (const token of new Lexer().lex(text)) {
    const at = offset;
    const type = CST.tokenType(token);
    // The lexer marks documents and scalars with control characters that are not in the text.
    const marker = type === 'doc-mode' || type === 'scalar' || type === 'flow-error-end';
    if (!marker) offset += token.length;
    if (type === 'newline') {
      atLineStart = true;
      lineStart = offset;
      continue;
    }
    if (type === 'space' || type === 'comment' || type === 'doc-mode' || type === 'flow-error-end') continue;
    if (!scalarFollows) {
      if (flow === 0 && (atLineStart || type === 'seq-item-ind' || type === 'explicit-key-ind')) {
        const column = at - lineStart;
        while (blockColumns.length > 0 && blockColumns[blockColumns.length - 1] > column) blockColumns.pop();
        if (blockColumns[blockColumns.length - 1] !== column) blockColumns.push(column);
      }
      if (type === 'flow-map-start' || type === 'flow-seq-start') flow++;
      if (type === 'flow-map-end' || type === 'flow-seq-end') flow = Math.max(0, flow - 1);
      if (blockColumns.length + flow > INPUT_LIMITS.nesting) {
        const { line, col } = position(text, at);
        return `${path}:${line}:${col}: nested more than ${INPUT_LIMITS.nesting} levels deep (see "Limits" in the README)`;
      }
    }
    // A scalar marker is followed by the scalar's text, whatever that looks like.
    scalarFollows = type === 'scalar';
    atLineStart = false;
    const lastBreak = token.lastIndexOf('\n');
    if (!marker && lastBreak >= 0) {
      lineStart = at + lastBreak + 1;
      atLineStart = lastBreak === token.length - 1;
    }
  }
  return null;
}

/** 1-based line and column of a text offset. */
function position(text: string, offset: number): { line: number; col: number } {
  let line = 1;
  let start = 0;
  for (let i = text.indexOf('\n'); i >= 0 && i < offset; i = text.indexOf('\n', i + 1)) {
    line++;
    start = i + 1;
  }
  return { line, col: offset - start + 1 };
}
