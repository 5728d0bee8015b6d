import { isAlias, isMap, isScalar, isSeq, type Node as YamlNode, type YAMLMap } from 'yaml';
import type { Problems } from './problems.js';
import { suggestion } from './spelling.js';

/** The key path of `key` inside the mapping at `at` ('' for the top level): `materials.1 (boards).colour`. */
export function keyPath(at: string, key: string | number): string {
  return at === '' ? String(key) : `${at}.${key}`;
}

/**
 * The label of a list item: its 0-based index, and its name when it has one
 * (`materials.2 (moss)`), as config paths count list items.
 */
export function itemPath(list: string, index: number, node: YamlNode): string {
  const name = isMap(node) ? node.get('name') : undefined;
  return typeof name === 'string' && name.trim() !== '' ? `${list}.${index} (${name})` : `${list}.${index}`;
}

/** The value nodes of a YAML mapping by key, after unknown and missing keys are reported. */
export interface Fields {
  /** The node the mapping came from, for problems about the whole mapping. */
  readonly node: YamlNode;
  /** The mapping's key path, '' at the top level: "materials.1 (boards)", "start". */
  readonly at: string;
  readonly values: ReadonlyMap<string, YamlNode>;
}

/** Reads a mapping's keys, reporting unknown keys (with the nearest valid one) and missing required keys. */
export function readFields(
  node: YamlNode | null | undefined, at: string, allowed: readonly string[],
  required: readonly string[], problems: Problems,
): Fields | null {
  if (node == null || !isMap(node)) {
    problems.report(node, `${at === '' ? '(top level)' : at}: expected a mapping of keys to values`);
    return null;
  }
  const values = new Map<string, YamlNode>();
  const firstAt = new Map<string, YamlNode>();
  for (const pair of (node as YAMLMap<YamlNode, YamlNode>).items) {
    const keyNode = pair.key;
    const key = isScalar(keyNode) ? String(keyNode.value) : '';
    const path = keyPath(at, key);
    if (key === '<<') {
      problems.report(keyNode, `${path}: merge keys are not read in world files; write the keys out`);
    } else if (!allowed.includes(key)) {
      problems.report(keyNode, `${path}: unknown key${suggestion(key, allowed)}; expected one of ${allowed.join(', ')}`);
    } else if (firstAt.has(key)) {
      problems.report(keyNode, `${path}: the key is written twice (first at ${problems.lineAndColumn(firstAt.get(key))}); keep one`);
    } else {
      firstAt.set(key, keyNode);
      if (isAlias(pair.value)) {
        problems.report(pair.value, `${path}: a YAML alias; world files do not read aliases, so write the value out`);
      } else if (pair.value == null || (isScalar(pair.value) && pair.value.value == null)) {
        problems.report(keyNode, `${path}: has no value`);
      } else {
        values.set(key, pair.value);
      }
    }
  }
  for (const key of required) {
    if (!firstAt.has(key)) problems.report(node, `${keyPath(at, key)}: required, missing from ${at === '' ? 'the world' : at}`);
  }
  return { node, at, values };
}

/** Bounds for a number; `above` is exclusive, `min`/`max` inclusive. */
export interface NumberRule {
  readonly min?: number;
  readonly above?: number;
  readonly max?: number;
  readonly integer?: boolean;
}

function describeRule(rule: NumberRule): string {
  const kind = rule.integer ? 'an integer' : 'a number';
  const low = rule.above != null ? `> ${rule.above}` : rule.min != null ? `>= ${rule.min}` : '';
  const high = rule.max != null ? `<= ${rule.max}` : '';
  return [kind, [low, high].filter((s) => s !== '').join(' and ')].filter((s) => s !== '').join(' ');
}

function breaks(value: number, rule: NumberRule): boolean {
  return !Number.isFinite(value) || (rule.integer === true && !Number.isInteger(value))
    || (rule.min != null && value < rule.min) || (rule.above != null && value <= rule.above)
    || (rule.max != null && value > rule.max);
}

/**
 * How a node's value reads in a message: `1.3`, `"##"`, `a list`. A number that is not
 * finite keeps its spelling (`.nan`, `1e400`), where JSON would print null.
 */
function shown(node: YamlNode): string {
  if (isScalar(node) && typeof node.value === 'number' && !Number.isFinite(node.value)) return `${node.source ?? String(node.value)} (not a finite number)`;
  if (isScalar(node)) return JSON.stringify(node.value);
  return isSeq(node) ? 'a list' : 'a mapping';
}

/** Checks one scalar node as a number; reports and returns null when it is not one in range. */
export function numberAt(node: YamlNode, path: string, rule: NumberRule, problems: Problems): number | null {
  const value = isScalar(node) ? node.value : undefined;
  if (typeof value !== 'number' || breaks(value, rule)) {
    problems.report(node, `${path}: expected ${describeRule(rule)}, got ${shown(node)}`);
    return null;
  }
  return value;
}

/** A required or optional number field; the default is used when the key is absent. */
export function numberField(
  fields: Fields, key: string, rule: NumberRule, problems: Problems, fallback?: number,
): number | null {
  const node = fields.values.get(key);
  if (node == null) return fallback ?? null;
  return numberAt(node, keyPath(fields.at, key), rule, problems);
}

/**
 * A string field; `oneChar` demands a map glyph: one visible character that takes one
 * column in a terminal, so map rows stay aligned (wide characters such as emoji and CJK
 * ideographs take two, UAX #11).
 */
export function stringField(
  fields: Fields, key: string, problems: Problems, options: { oneChar?: boolean; fallback?: string } = {},
): string | null {
  const node = fields.values.get(key);
  if (node == null) return options.fallback ?? null;
  const path = keyPath(fields.at, key);
  const value = isScalar(node) ? node.value : undefined;
  if (typeof value !== 'string' && typeof value !== 'number') {
    problems.report(node, `${path}: expected text, got ${shown(node)}`);
    return null;
  }
  const text = String(value);
  if (options.oneChar === true && !isNarrowGlyph(text)) {
    problems.report(node, `${path}: expected one single-width visible character (emoji and other wide characters are not allowed), got ${JSON.stringify(text)}`);
    return null;
  }
  if (options.oneChar !== true && text.trim() === '') {
    problems.report(node, `${path}: expected text, got an empty string`);
    return null;
  }
  return text;
}

/**
 * Whether text is one visible character one terminal column wide: a single UTF-16 unit
 * (map rows are indexed by it), not a space, control, combining mark or emoji, and
 * outside the East Asian Wide and Fullwidth blocks (Unicode UAX #11: Hangul Jamo, CJK,
 * Hangul syllables, compatibility ideographs, vertical and fullwidth forms).
 */
function isNarrowGlyph(text: string): boolean {
  if (text.length !== 1 || /[\s\p{C}\p{M}\p{Emoji_Presentation}]/u.test(text)) return false;
  const code = text.charCodeAt(0);
  const wide: readonly [number, number][] = [
    [0x1100, 0x115f], [0x2e80, 0x303e], [0x3041, 0x33ff], [0x3400, 0x4dbf], [0x4e00, 0x9fff], [0xa000, 0xa4cf],
    [0xac00, 0xd7a3], [0xf900, 0xfaff], [0xfe30, 0xfe4f], [0xff00, 0xff60], [0xffe0, 0xffe6],
  ];
  return !wide.some(([low, high]) => code >= low && code <= high);
}

/** A true/false field with a default. */
export function booleanField(fields: Fields, key: string, problems: Problems, fallback: boolean): boolean {
  const node = fields.values.get(key);
  if (node == null) return fallback;
  if (isScalar(node) && typeof node.value === 'boolean') return node.value;
  problems.report(node, `${keyPath(fields.at, key)}: expected true or false, got ${shown(node)}`);
  return fallback;
}

/** A list of numbers of a fixed length, each checked by `rule`. */
export function vectorField(
  fields: Fields, key: string, length: number, rule: NumberRule, problems: Problems,
): number[] | null {
  const node = fields.values.get(key);
  if (node == null) return null;
  const path = keyPath(fields.at, key);
  if (!isSeq(node) || node.items.length !== length) {
    const got = isSeq(node) ? `${node.items.length} item${node.items.length === 1 ? '' : 's'}` : shown(node);
    problems.report(node, `${path}: expected a list of ${length} numbers, got ${got}`);
    return null;
  }
  const values = (node.items as YamlNode[]).map((item, i) => numberAt(item, keyPath(path, i), rule, problems));
  return values.every((v): v is number => v != null) ? values : null;
}

/** The items of a list field, or null (reported) when it is not a list. */
export function listField(fields: Fields, key: string, problems: Problems): YamlNode[] | null {
  const node = fields.values.get(key);
  if (node == null) return null;
  if (!isSeq(node)) {
    problems.report(node, `${keyPath(fields.at, key)}: expected a list, got ${shown(node)}`);
    return null;
  }
  return node.items as YamlNode[];
}
