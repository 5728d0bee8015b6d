import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { isAlias, isMap, isScalar, isSeq, LineCounter, parseDocument, visit } from 'yaml';
import { fileSizeProblem, INPUT_LIMITS, yamlNestingProblem } from '../input-limits.js';
import { checkConfig } from './config-checks.js';
import { ConfigError, duplicateKeys, formatProblems, pathText, type ConfigProblem, type ConfigSource } from './config-errors.js';
import { configParts } from './config-parts.js';
import { constantTargetWarnings } from './constant-targets.js';
import { DEFAULTS } from './defaults.js';
import { wrongKind } from './file-kind.js';
import { PluginCatalog } from './plugin-catalog.js';
import { resolveSettings, type Sweep } from './resolved-config.js';
import { configSchema, type FilledConfig } from './schema.js';
import { varyProblems } from './vary-checks.js';
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
  const raw = plainData(source);
  fail(sweepSizeProblems(raw));
  const parts = configParts(raw);
  const plugins = new PluginCatalog(configDir);
  const configProblems = (config: unknown) => problemsOf(config, plugins);
  const named = checkNamedWorlds(parts.merged, configDir);
  fail([
    ...duplicateKeys(source),
    ...configProblems(raw),
    ...named.problems,
    ...varyProblems(parts, configProblems),
  ]);
  const filled = configSchema.parse(raw);
  const varyKeys = Object.keys(filled.vary);
  const matches = varyKeys.map((key) => matchVaryPath(filled, key));
  const combinations = cartesian(varyKeys.map((key) => filled.vary[key])).map((values) => {
    const config = withValues(filled, values.map((value, i) => ({ paths: matches[i], value })));
    const problems = configProblems(config);
    if (problems.length > 0) fail([{ path: ['vary'], message: `the combination ${values.map(varyText).join(', ')} is invalid: ${pathText(problems[0].path, config)}: ${problems[0].message}` }]);
    return {
      vary: Object.fromEntries(varyKeys.map((key, i) => [key, varyText(values[i])])),
      settings: resolveSettings(config, resolve(configDir, config.world), plugins),
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
    warnings: formatProblems(source, locatedAtWorld(source, constantTargetWarnings(combinations, named.worlds))),
    plugins: plugins.plugins,
  };
}

/** Every problem of a config file as `path:line:col: key: reason` (empty when it is valid), and its warnings when it is. */
export function inspectConfigFile(path: string): { readonly problems: readonly string[]; readonly warnings: readonly string[] } {
  try {
    return { problems: [], warnings: loadSweep(path).warnings };
  } catch (error) {
    if (error instanceof ConfigError) return { problems: error.lines, warnings: [] };
    throw error;
  }
}

/** Every problem of a config file as `path:line:col: key: reason`; empty when it is valid. */
export function checkConfigFile(path: string): string[] {
  return [...inspectConfigFile(path).problems];
}

function outFolder(filled: FilledConfig, configDir: string, options: LoadOptions): string {
  if (options.out != null) return resolve(options.out);
  if (filled.out != null) return resolve(configDir, filled.out);
  return resolve(configDir, DEFAULTS.outRoot, filled.name);
}

function parseSource(file: string): ConfigSource {
  const tooLarge = fileSizeProblem(file, INPUT_LIMITS.configBytes, 'config file');
  if (tooLarge != null) throw new ConfigError([tooLarge]);
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    throw new ConfigError([`${file}:1:1: cannot read the config file (${(error as NodeJS.ErrnoException).code ?? String(error)})`]);
  }
  const tooDeep = yamlNestingProblem(text, file);
  if (tooDeep != null) throw new ConfigError([tooDeep]);
  const wrong = wrongKind(text, file, 'config');
  if (wrong != null) throw new ConfigError([wrong]);
  const lineCounter = new LineCounter();
  // Duplicate keys are found by duplicateKeys, with their key path, among the other problems;
  // logLevel 'error': a collection used as a key is reported as an unknown key, not as a Node warning on stderr.
  const doc = parseDocument(text, { merge: true, lineCounter, prettyErrors: false, uniqueKeys: false, logLevel: 'error' });
  if (doc.errors.length > 0) {
    throw new ConfigError(doc.errors.map((error) => {
      const { line, col } = lineCounter.linePos(error.pos[0]);
      return `${file}:${line}:${col}: YAML syntax: ${error.message.split('\n')[0]}`;
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

/**
 * A sweep of more cells than INPUT_LIMITS.sweepCells, counted from the raw config before
 * anything is checked value by value or expanded (lists the schema will refuse count as
 * one, so the count never exceeds what a valid config of the same lists would give).
 */
function sweepSizeProblems(raw: unknown): ConfigProblem[] {
  const section = (key: string): unknown => (raw != null && typeof raw === 'object' ? (raw as Record<string, unknown>)[key] : undefined);
  const length = (list: unknown) => (Array.isArray(list) ? Math.max(1, list.length) : 1);
  const vary = section('vary');
  const lists = vary != null && typeof vary === 'object' && !Array.isArray(vary) ? Object.values(vary) : [];
  const combinations = lists.reduce<number>((n, values) => n * length(values), 1);
  const [seeds, learners] = [length(section('seeds')), length(section('learners'))];
  const cells = combinations * seeds * learners;
  if (cells <= INPUT_LIMITS.sweepCells) return [];
  const counted = (n: number, noun: string) => `${n} ${noun}${n === 1 ? '' : 's'}`;
  const factors = [counted(combinations, 'vary combination'), counted(seeds, 'seed'), counted(learners, 'learner')].join(' × ');
  return [{
    path: [lists.length > 0 ? 'vary' : 'seeds'], atKey: true,
    message: `the sweep has ${cells} cells (${factors}); at most ${INPUT_LIMITS.sweepCells} are run from one config (see "Limits" in the README): split it into several configs`,
  }];
}

/** Warnings about default probe targets point at the world they cannot vary in, as the file has no targets to point at. */
function locatedAtWorld(source: ConfigSource, warnings: readonly ConfigProblem[]): ConfigProblem[] {
  const world = source.doc.getIn(['world'], true) as { range?: [number] } | undefined;
  if (source.doc.hasIn(['probe', 'targets']) || world?.range == null) return [...warnings];
  return warnings.map((warning) => ({ ...warning, offset: world.range?.[0] }));
}

/** Every problem of the schema and of the checks beyond it, each check run on whatever parts of the config are valid. */
function problemsOf(config: unknown, plugins: PluginCatalog): ConfigProblem[] {
  const parsed = configSchema.safeParse(config, { reportInput: true });
  return [...(parsed.success ? [] : problemsFromIssues(configSchema, parsed.error.issues)), ...checkConfig(configParts(config), plugins)];
}
