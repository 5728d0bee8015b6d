import type { LineCounter, Node as YamlNode } from 'yaml';
import { oneLine } from '../input-limits.js';

/** Where in a file a problem was found: a YAML node or a raw character offset. */
export type Place = YamlNode | number | null | undefined;

/** Collects `path:line:col: reason` lines for one file. */
export interface Problems {
  readonly path: string;
  readonly list: string[];
  /** Records one problem at a node or offset (line 1, column 1 when unknown). */
  report(place: Place, reason: string): void;
  /** The `path:line:col` of a place, for messages that point back to another spot. */
  where(place: Place): string;
  /** `line L, column C` of a place in this file. */
  lineAndColumn(place: Place): string;
  /** The problems in file order (stable for one place), as configs list theirs. */
  inFileOrder(): string[];
}

/** A problem collector for the file at `path`, positioned by its line counter. */
export function createProblems(path: string, lines: LineCounter): Problems {
  const position = (place: Place) => lines.linePos(typeof place === 'number' ? place : place?.range?.[0] ?? 0);
  const where = (place: Place): string => {
    const { line, col } = position(place);
    return `${path}:${line}:${col}`;
  };
  const lineAndColumn = (place: Place): string => {
    const { line, col } = position(place);
    return `line ${line}, column ${col}`;
  };
  const list: string[] = [];
  const offsets: number[] = [];
  const report = (place: Place, reason: string) => {
    // Line breaks and other control characters from the file are escaped: one problem, one line.
    list.push(`${where(place)}: ${oneLine(reason)}`);
    offsets.push(typeof place === 'number' ? place : place?.range?.[0] ?? 0);
  };
  const inFileOrder = () => list.map((text, i) => ({ text, offset: offsets[i] })).sort((a, b) => a.offset - b.offset).map((entry) => entry.text);
  return { path, list, where, lineAndColumn, report, inFileOrder };
}

/** Thrown by loadWorld: its message holds every problem, one per line. */
export class WorldFileError extends Error {
  constructor(readonly problems: readonly string[]) {
    super(problems.join('\n'));
    this.name = 'WorldFileError';
  }
}
