import { isMap, isPair, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';
import { oneLine } from '../input-limits.js';

/** One thing wrong with a config, at a key path inside it. */
export interface ConfigProblem {
  readonly path: readonly (string | number)[];
  readonly message: string;
  /** Point at the key itself rather than its value (unknown keys). */
  readonly atKey?: boolean;
  /** The text offset to point at, when the node at `path` is not the place (the second of two equal keys). */
  readonly offset?: number;
  /** A warning rather than an error: the line reads `file:line:col: warning: key: message` and nothing stops. */
  readonly warning?: boolean;
  /** Lines printed right after this one, already located elsewhere (the problems of a world file it names). */
  readonly detail?: readonly string[];
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
  const data: unknown = source.doc.toJS();
  const located = problems.map((problem) => {
    const offset = problem.offset ?? offsetOf(source.doc, problem.path, problem.atKey === true);
    const { line, col } = source.lineCounter.linePos(offset);
    const key = problem.path.length === 0 ? '(top level)' : pathText(problem.path, data);
    const kind = problem.warning === true ? 'warning: ' : '';
    // One problem, one line, whatever the config held in its keys and values.
    return { offset, lines: [oneLine(`${source.file}:${line}:${col}: ${kind}${key}: ${problem.message}`), ...problem.detail ?? []] };
  });
  located.sort((a, b) => a.offset - b.offset);
  const seen = new Set<string>();
  return located.flatMap(({ lines }) => (seen.has(lines[0]) ? [] : (seen.add(lines[0]), lines)));
}

/**
 * A key path as messages show it: dotted, list items by their 0-based index (as `vary`
 * paths count them) followed by the item's name when it has one:
 * `learners.0 (sound-from-sight).encoder.hidden`.
 */
export function pathText(path: readonly (string | number)[], data: unknown): string {
  let node = data;
  return path.map((segment) => {
    const item = node != null && typeof node === 'object' ? (node as Record<string | number, unknown>)[segment] : undefined;
    const name = Array.isArray(node) && item != null && typeof item === 'object' ? (item as { name?: unknown }).name : undefined;
    node = item;
    return typeof name === 'string' ? `${segment} (${name})` : String(segment);
  }).join('.');
}

/** Each key written twice in one mapping, at its second place (YAML 1.2 §3.2.1.1: keys are unique). */
export function duplicateKeys(source: ConfigSource): ConfigProblem[] {
  const problems: ConfigProblem[] = [];
  const visit = (node: unknown, path: readonly (string | number)[]): void => {
    if (isSeq(node)) node.items.forEach((item, i) => visit(item, [...path, i]));
    if (!isMap(node)) return;
    const first = new Map<string, number>();
    for (const pair of node.items) {
      if (!isPair(pair) || !isScalar(pair.key)) continue;
      const key = String(pair.key.value);
      const offset = rangeStart(pair.key) ?? 0;
      const earlier = first.get(key);
      if (key !== '<<' && earlier != null) {
        const { line, col } = source.lineCounter.linePos(earlier);
        problems.push({ path: [...path, key], offset, message: `the key is written twice (first at line ${line}, column ${col}); keep one` });
      } else first.set(key, offset);
      visit(pair.value, key === '<<' ? path : [...path, key]);
    }
  };
  visit(source.doc.contents, []);
  return problems;
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

export { suggestion } from '../world/spelling.js';
