import { isMap, isScalar, LineCounter, parseDocument } from 'yaml';
import { parseWorld, readWorldText, WORLD_KEYS } from '../world/parse.js';
import { WorldFileError } from '../world/problems.js';
import type { World } from '../world/types.js';
import { configSchema } from './schema.js';

/** The two kinds of YAML file crosswise reads. */
export type FileKind = 'world' | 'config';

const CONFIG_KEYS: readonly string[] = Object.keys(configSchema.shape);

/**
 * What a YAML text is, judged by its top-level keys: the kind with more of the keys only
 * it has (a world's `map`, `materials`, `emitters`...; a config's `learners`, `world`,
 * `seeds`...); null when neither has more. Duplicate keys and syntax errors later in the
 * file do not hide the kind: they are the checker's to report.
 */
export function fileKind(text: string): FileKind | null {
  const doc = parseDocument(text, { uniqueKeys: false });
  if (!isMap(doc.contents)) return null;
  const keys = new Set(doc.contents.items.map((pair) => (isScalar(pair.key) ? String(pair.key.value) : '')));
  const own = (mine: readonly string[], theirs: readonly string[]) => mine.filter((key) => keys.has(key) && !theirs.includes(key)).length;
  const world = own(WORLD_KEYS, CONFIG_KEYS);
  const config = own(CONFIG_KEYS, WORLD_KEYS);
  return world > config ? 'world' : config > world ? 'config' : null;
}

const WRONG_KIND: Readonly<Record<FileKind, string>> = {
  world: "this is a config, not a world (a world has 'map', 'materials' and 'emitters'; a config names its world under 'world')",
  config: "this is a world, not a config (a config has 'learners' and names a world file under 'world')",
};

/** `path:1:1: this is a config, not a world (...)` when the text is the other kind of file, else null; `hint` is added after a semicolon. */
export function wrongKind(text: string, path: string, expected: FileKind, hint?: string): string | null {
  const kind = fileKind(text);
  if (kind == null || kind === expected) return null;
  return `${path}:1:1: ${WRONG_KIND[expected]}${hint == null ? '' : `; ${hint}`}`;
}

/** Each YAML syntax error of a text as `path:line:col: YAML syntax: reason`. */
export function yamlSyntaxProblems(text: string, path: string): string[] {
  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, uniqueKeys: false, prettyErrors: false });
  return doc.errors.map((error) => {
    const { line, col } = lines.linePos(error.pos[0]);
    return `${path}:${line}:${col}: YAML syntax: ${error.message.split('\n')[0]}`;
  });
}

/**
 * Reads and validates a world file; throws WorldFileError with every problem, or with one
 * line saying the file is a config, not a world (and `hint`, what to do instead).
 */
export function readWorldFile(path: string, hint?: string): World {
  const text = readWorldText(path);
  const wrong = wrongKind(text, path, 'world', hint);
  if (wrong != null) throw new WorldFileError([wrong]);
  return parseWorld(text, path);
}

/** Every problem of a world file as `path:line:col: reason` lines (empty when valid). */
export function worldFileProblems(path: string): string[] {
  try {
    readWorldFile(path);
    return [];
  } catch (error) {
    if (error instanceof WorldFileError) return [...error.problems];
    throw error;
  }
}
