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
}

/** A problem collector for the file at `path`, positioned by its line counter. */
export function createProblems(path: string, lines: LineCounter): Problems {
  const where = (place: Place): string => {
    const offset = typeof place === 'number' ? place : place?.range?.[0] ?? 0;
    const { line, col } = lines.linePos(offset);
    return `${path}:${line}:${col}`;
  };
  const list: string[] = [];
  // Line breaks and other control characters from the file are escaped: one problem, one line.
  return { path, list, where, report: (place, reason) => list.push(`${where(place)}: ${oneLine(reason)}`) };
}

/** Thrown by loadWorld: its message holds every problem, one per line. */
export class WorldFileError extends Error {
  constructor(readonly problems: readonly string[]) {
    super(problems.join('\n'));
    this.name = 'WorldFileError';
  }
}
