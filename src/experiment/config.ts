import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { LineCounter, parseDocument } from 'yaml';
import { checkConfig } from './config-checks.js';
import { ConfigError, duplicateKeys, formatProblems, suggestion, type ConfigProblem, type ConfigSource } from './config-errors.js';
import { DEFAULTS } from './defaults.js';
import { wrongKind } from './file-kind.js';
import { resolveSettings, type Sweep } from './resolved-config.js';
import { configSchema, type FilledConfig } from './schema.js';
import { cartesian, matchVaryPath, varyText, withValues } from './vary.js';
import { checkNamedWorlds } from './world-checks.js';
import { problemsFromIssues } from './zod-problems.js';

/** Where the results go when neither the config nor the command line says. */
export interface LoadOptions {
  /** Overrides the config's `out` (resolved against the working directory). */
  readonly out?: string;
}

/**
 * Reads, validates and expands a config file; throws ConfigError listing every problem.
 * Reads files only: nothing is written.
 */
export function loadSweep(file: string, options: LoadOptions = {}): Sweep {
  const source = parseSource(file);
  const configDir = dirname(resolve(file));
  const fail = (problems: readonly ConfigProblem[]) => {
    if (problems.length > 0) throw new ConfigError(formatProblems(source, problems));
  };
  const duplicates = duplicateKeys(source);
  const raw: unknown = source.doc.toJS();
  const named = checkNamedWorlds(raw != null && typeof raw === 'object' ? raw : {}, configDir);
  const parsed = configSchema.safeParse(raw, { reportInput: true });
  if (!parsed.success) fail([...duplicates, ...problemsFromIssues(configSchema, parsed.error.issues), ...named.problems]);
  const filled = parsed.data as FilledConfig;
  fail([...duplicates, ...checkConfig(filled), ...named.problems]);
  const varyKeys = Object.keys(filled.vary);
  const matches = varyKeys.map((key) => matchVaryPath(filled, key));
  fail(varyKeys.flatMap((key, i) => checkVaryKey(filled, configDir, key, matches[i])));

  const combinations = cartesian(varyKeys.map((key) => filled.vary[key])).map((values) => {
    const config = withValues(filled, values.map((value, i) => ({ paths: matches[i], value })));
    const problems = validate(config);
    if (problems.length > 0) fail([{ path: ['vary'], message: `the combination ${values.map(varyText).join(', ')} is invalid: ${problems[0].message}` }]);
    return {
      vary: Object.fromEntries(varyKeys.map((key, i) => [key, varyText(values[i])])),
      settings: resolveSettings(config, resolve(configDir, config.world)),
    };
  });
  return {
    name: filled.name,
    configPath: resolve(file),
    out: outFolder(filled, configDir, options),
    seeds: filled.seeds,
    backend: filled.backend,
    varyKeys,
    combinations,
    filled,
  };
}

/** Every problem of a config file as `path:line:col: key: reason`; empty when it is valid. */
export function checkConfigFile(path: string): string[] {
  try {
    loadSweep(path);
    return [];
  } catch (error) {
    if (error instanceof ConfigError) return [...error.lines];
    throw error;
  }
}

function outFolder(filled: FilledConfig, configDir: string, options: LoadOptions): string {
  if (options.out != null) return resolve(options.out);
  if (filled.out != null) return resolve(configDir, filled.out);
  return resolve(DEFAULTS.outRoot, filled.name);
}

function parseSource(file: string): ConfigSource {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    throw new ConfigError([`${file}: cannot read the config file (${(error as NodeJS.ErrnoException).code ?? String(error)})`]);
  }
  const wrong = wrongKind(text, file, 'config');
  if (wrong != null) throw new ConfigError([wrong]);
  const lineCounter = new LineCounter();
  // Duplicate keys are found by duplicateKeys, with their key path, among the other problems.
  const doc = parseDocument(text, { merge: true, lineCounter, prettyErrors: false, uniqueKeys: false });
  if (doc.errors.length > 0) {
    throw new ConfigError(doc.errors.map((error) => {
      const { line, col } = lineCounter.linePos(error.pos[0]);
      return `${file}:${line}:${col}: YAML syntax: ${error.message.split('\n')[0]}`;
    }));
  }
  return { file, doc, lineCounter };
}

function validate(config: FilledConfig): ConfigProblem[] {
  const parsed = configSchema.safeParse(config, { reportInput: true });
  if (!parsed.success) return problemsFromIssues(configSchema, parsed.error.issues);
  return checkConfig(parsed.data);
}

function checkVaryKey(filled: FilledConfig, configDir: string, key: string, paths: readonly (readonly (string | number)[])[]): ConfigProblem[] {
  const at = ['vary', key];
  if (paths.length === 0) {
    return [{ path: at, atKey: true, message: `matches no setting${suggestion(key, settablePaths(filled))}` }];
  }
  const values = filled.vary[key];
  const texts = values.map(varyText);
  return values.flatMap((value, i) => {
    if (texts.indexOf(texts[i]) < i) return [{ path: [...at, i], message: `value ${texts[i]} is listed twice` }];
    const problems = validate(withValues(filled, [{ paths, value }]));
    return problems.length === 0 ? [] : [{ path: [...at, i], message: `value ${texts[i]} is invalid: ${problems[0].path.join('.')}: ${problems[0].message}` }];
  });
}

/** Dotted paths of every setting a vary key could name, for suggestions. */
function settablePaths(filled: FilledConfig): string[] {
  const flatten = (node: unknown, prefix: string): string[] => {
    if (node == null || typeof node !== 'object' || Array.isArray(node)) return [prefix];
    return Object.entries(node).flatMap(([key, value]) => flatten(value, `${prefix}.${key}`));
  };
  return [
    'world',
    ...flatten(filled.collect, 'collect'),
    ...flatten(filled.senses, 'senses'),
    ...filled.learners.flatMap((learner) => flatten(learner, 'learners.*')),
    ...flatten(filled.probe, 'probe'),
    ...filled.noise.flatMap((entry) => flatten(entry, 'noise.*')),
  ];
}
