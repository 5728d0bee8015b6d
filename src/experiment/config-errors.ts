import { closest, distance } from 'fastest-levenshtein';
import { isMap, isPair, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';
import { oneLine } from '../input-limits.js';

/** One thing wrong with a config, at a key path inside it. */
export interface ConfigProblem {
  readonly path: readonly (string | number)[];
  readonly message: string;
  /** Point at the key itself rather than its value (unknown keys). */
  readonly atKey?: boolean;
}

/** A config that cannot be used; `lines` holds one `file:line:col: key: reason` line per problem. */
export class ConfigError extends Error {
  constructor(readonly lines: readonly string[]) {
    super(lines.join('\n'));
    this.name = 'ConfigError';
  }
}

/** The parsed YAML a config came from, for pointing problems at their line and column. */
export interface ConfigSource {
  readonly file: string;
  readonly doc: Document.Parsed;
  readonly lineCounter: LineCounter;
}

/** Formats problems as `file:line:col: key.path: message`, in file order. */
export function formatProblems(source: ConfigSource, problems: readonly ConfigProblem[]): string[] {
  const located = problems.map((problem) => {
    const offset = offsetOf(source.doc, problem.path, problem.atKey === true);
    const { line, col } = source.lineCounter.linePos(offset);
    const key = problem.path.length === 0 ? '(top level)' : problem.path.join('.');
    // One problem, one line, whatever the config held in its keys and values.
    return { offset, text: oneLine(`${source.file}:${line}:${col}: ${key}: ${problem.message}`) };
  });
  located.sort((a, b) => a.offset - b.offset);
  return [...new Set(located.map((entry) => entry.text))];
}

/** Text offset of the node at `path`, or of its deepest existing ancestor (keys brought in by `<<` merges have none of their own). */
function offsetOf(doc: Document.Parsed, path: readonly (string | number)[], atKey: boolean): number {
  let node: unknown = doc.contents;
  let offset = rangeStart(node) ?? 0;
  for (const segment of path) {
    if (isMap(node)) {
      const pair = node.items.find((item) => isPair(item) && isScalar(item.key) && String(item.key.value) === String(segment));
      if (pair == null) return offset;
      offset = (atKey && segment === path[path.length - 1] ? rangeStart(pair.key) : rangeStart(pair.value)) ?? offset;
      node = pair.value;
    } else if (isSeq(node) && typeof segment === 'number' && segment < node.items.length) {
      node = node.items[segment];
      offset = rangeStart(node) ?? offset;
    } else {
      return offset;
    }
  }
  return offset;
}

function rangeStart(node: unknown): number | undefined {
  return (node as Node | null)?.range?.[0];
}

/** ` (did you mean 'x'?)` for the nearest of `options`, or nothing when none is close. */
export function suggestion(word: string, options: readonly string[]): string {
  if (options.length === 0) return '';
  const nearest = closest(word, [...options]);
  const limit = Math.max(2, Math.floor(word.length / 3));
  // Only suggest a word that is plausibly a misspelling of the nearest option.
  const edits = distance(word, nearest);
  return edits <= limit && edits < word.length ? ` (did you mean '${nearest}'?)` : '';
}
