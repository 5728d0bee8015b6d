import { pathText, suggestion, type ConfigProblem } from './config-errors.js';
import type { ConfigParts } from './config-parts.js';
import { configSchema } from './schema.js';
import { matchVaryPath, VARIABLE_SECTIONS, varyText, withValues } from './vary.js';
import { schemaPaths } from './zod-problems.js';

/** Every setting path a vary key may name, lists written `*`. */
const SETTING_PATHS = schemaPaths(configSchema).filter((path) => (VARIABLE_SECTIONS as readonly string[]).includes(path.split('.')[0]));

/** Whether `key` names a setting of the schema: `*`, an index or a name where a list is, then optionally indices into a list value. */
function namesSetting(key: string): boolean {
  const segments = key.split('.');
  return SETTING_PATHS.some((path) => {
    const pattern = path.split('.');
    if (segments.length < pattern.length) return false;
    const fits = pattern.every((part, i) => part === '*' || part === segments[i]);
    return fits && segments.slice(pattern.length).every((segment) => /^\d+$/.test(segment));
  });
}

/** The setting paths again with each learner's name and index in place of `*`, for suggestions. */
function namedPaths(merged: Readonly<Record<string, unknown>>): string[] {
  const learners = Array.isArray(merged.learners) ? merged.learners as unknown[] : [];
  const labels = learners.flatMap((learner, i) => [String(i), ...(typeof (learner as { name?: unknown })?.name === 'string' ? [(learner as { name: string }).name] : [])]);
  return SETTING_PATHS.flatMap((path) => (path.startsWith('learners.*.') ? labels.map((label) => path.replace('*', label)) : [path]));
}

const problemKey = (problem: ConfigProblem) => `${problem.path.join('.')}\n${problem.message}`;

/**
 * Problems of a config's `vary` keys and values: a key that names no setting (with the
 * nearest that does), a value listed twice, and a value that makes the config invalid
 * (a problem the config as written does not already have). A key whose section has
 * problems of its own is checked against the schema only.
 */
export function varyProblems(parts: ConfigParts, problemsOf: (config: unknown) => readonly ConfigProblem[]): ConfigProblem[] {
  const vary = parts.merged.vary;
  if (vary == null || typeof vary !== 'object' || Array.isArray(vary)) return [];
  let known: Set<string> | undefined;
  return Object.entries(vary as Record<string, unknown>).flatMap(([key, values]): ConfigProblem[] => {
    const at = ['vary', key];
    if (!namesSetting(key)) return [{ path: at, atKey: true, message: `matches no setting${suggestion(key, SETTING_PATHS)}` }];
    if (!parts.valid(key.split('.')[0]) || !Array.isArray(values)) return [];
    const paths = matchVaryPath(parts.merged, key);
    if (paths.length === 0) return [{ path: at, atKey: true, message: `matches no setting${suggestion(key, namedPaths(parts.merged))}` }];
    const texts = values.map(varyText);
    return values.flatMap((value, i): ConfigProblem[] => {
      if (texts.indexOf(texts[i]) < i) return [{ path: [...at, i], message: `value ${texts[i]} is listed twice` }];
      known ??= new Set(problemsOf(parts.merged).map(problemKey));
      const fresh = problemsOf(withValues(parts.merged, [{ paths, value }])).filter((problem) => !known?.has(problemKey(problem)));
      return fresh.length === 0 ? [] : [{ path: [...at, i], message: `value ${texts[i]} is invalid: ${pathText(fresh[0].path, parts.merged)}: ${fresh[0].message}` }];
    });
  });
}
