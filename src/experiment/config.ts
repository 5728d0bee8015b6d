import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { isAlias, isMap, isScalar, isSeq, LineCounter, parseDocument, visit } from 'yaml';
import { fileSizeProblem, INPUT_LIMITS, yamlNestingProblem } from '../input-limits.js';
import { checkConfig } from './config-checks.js';
import { ConfigError, formatProblems, suggestion, type ConfigProblem, type ConfigSource } from './config-errors.js';
import { DEFAULTS } from './defaults.js';
import { resolveSettings, type Sweep } from './resolved-config.js';
import { configSchema, type FilledConfig } from './schema.js';
import { cartesian, matchVaryPath, varyText, withValues } from './vary.js';
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
  const parsed = configSchema.safeParse(plainData(source), { reportInput: true });
  if (!parsed.success) fail(problemsFromIssues(configSchema, parsed.error.issues));
  const filled = parsed.data as FilledConfig;
  fail(sweepSizeProblems(filled));
  fail(checkConfig(filled, configDir));
  const varyKeys = Object.keys(filled.vary);
  const matches = varyKeys.map((key) => matchVaryPath(filled, key));
  fail(varyKeys.flatMap((key, i) => checkVaryKey(filled, configDir, key, matches[i])));

  const combinations = cartesian(varyKeys.map((key) => filled.vary[key])).map((values) => {
    const config = withValues(filled, values.map((value, i) => ({ paths: matches[i], value })));
    const problems = validate(config, configDir);
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
  const tooLarge = fileSizeProblem(file, INPUT_LIMITS.configBytes, 'config file');
  if (tooLarge != null) throw new ConfigError([tooLarge]);
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    throw new ConfigError([`${file}: cannot read the config file (${(error as NodeJS.ErrnoException).code ?? String(error)})`]);
  }
  const tooDeep = yamlNestingProblem(text, file);
  if (tooDeep != null) throw new ConfigError([tooDeep]);
  const lineCounter = new LineCounter();
  // logLevel 'error': a collection used as a key is reported as an unknown key, not as a Node warning on stderr.
  const doc = parseDocument(text, { merge: true, lineCounter, prettyErrors: false, logLevel: 'error' });
  if (doc.errors.length > 0) {
    throw new ConfigError(doc.errors.map((error) => {
      const { line, col } = lineCounter.linePos(error.pos[0]);
      return `${file}:${line}:${col}: (YAML): ${error.message.split('\n')[0]}`;
    }));
  }
  return { file, doc, lineCounter };
}

/**
 * The config as plain data. Aliases are expanded with the `yaml` package's guard against
 * alias bombs (a few lines whose aliases nest into billions of nodes); tripping it is one
 * line at the first alias that brings in other aliases. A merge (`<<`) of something that
 * is not a mapping is one line at that merge.
 */
function plainData(source: ConfigSource): unknown {
  try {
    return source.doc.toJS({ maxAliasCount: INPUT_LIMITS.aliasNodes });
  } catch (error) {
    if (!(error instanceof Error)) throw error;
    const bomb = error instanceof ReferenceError;
    const { line, col } = source.lineCounter.linePos((bomb ? nestedAliasOffset(source.doc) : badMergeOffset(source.doc)) ?? 0);
    const reason = bomb
      ? `an alias here expands to more than ${INPUT_LIMITS.aliasNodes} nodes (aliases of aliases; see "Limits" in the README)`
      : error.message.split('\n')[0];
    throw new ConfigError([`${source.file}:${line}:${col}: (YAML): ${reason}`]);
  }
}

/** Offset of the first alias whose anchored node holds aliases itself, else of the first alias. */
function nestedAliasOffset(doc: ConfigSource['doc']): number | undefined {
  let first: number | undefined;
  let nested: number | undefined;
  visit(doc, {
    Alias(_, alias) {
      first ??= alias.range?.[0];
      let holdsAliases = false;
      const target = alias.resolve(doc);
      if (target != null) visit(target, { Alias: () => { holdsAliases = true; return visit.BREAK; } });
      if (!holdsAliases) return undefined;
      nested = alias.range?.[0];
      return visit.BREAK;
    },
  });
  return nested ?? first;
}

/** Offset of the first merge key (`<<`) whose value is not a mapping or a list of them. */
function badMergeOffset(doc: ConfigSource['doc']): number | undefined {
  let found: number | undefined;
  const isMapping = (node: unknown): boolean => isMap(isAlias(node) ? node.resolve(doc) : node);
  visit(doc, {
    Pair(_, pair) {
      if (!isScalar(pair.key) || pair.key.value !== '<<') return undefined;
      const ok = isSeq(pair.value) ? pair.value.items.every(isMapping) : isMapping(pair.value);
      if (ok) return undefined;
      found = pair.key.range?.[0];
      return visit.BREAK;
    },
  });
  return found;
}

/** A sweep of more cells than INPUT_LIMITS.sweepCells, counted before anything is expanded. */
function sweepSizeProblems(filled: FilledConfig): ConfigProblem[] {
  const combinations = Object.values(filled.vary).reduce((n, values) => n * Math.max(1, values.length), 1);
  const cells = combinations * filled.seeds.length * filled.learners.length;
  if (cells <= INPUT_LIMITS.sweepCells) return [];
  const counted = (n: number, noun: string) => `${n} ${noun}${n === 1 ? '' : 's'}`;
  const factors = [counted(combinations, 'vary combination'), counted(filled.seeds.length, 'seed'), counted(filled.learners.length, 'learner')].join(' × ');
  return [{
    path: [Object.keys(filled.vary).length > 0 ? 'vary' : 'seeds'], atKey: true,
    message: `the sweep has ${cells} cells (${factors}); at most ${INPUT_LIMITS.sweepCells} are run from one config (see "Limits" in the README): split it into several configs`,
  }];
}

function validate(config: FilledConfig, configDir: string): ConfigProblem[] {
  const parsed = configSchema.safeParse(config, { reportInput: true });
  if (!parsed.success) return problemsFromIssues(configSchema, parsed.error.issues);
  return checkConfig(parsed.data, configDir);
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
    const problems = validate(withValues(filled, [{ paths, value }]), configDir);
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
