import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { WorldFileError } from '../world/problems.js';
import type { World } from '../world/types.js';
import type { ConfigProblem } from './config-errors.js';
import { readWorldFile } from './file-kind.js';

/** The worlds a config names, each read and validated once. */
export interface WorldCheck {
  /** One problem per named world that is missing or invalid; an invalid world's own located lines are its detail. */
  readonly problems: readonly ConfigProblem[];
  /** Every valid world by absolute path. */
  readonly worlds: ReadonlyMap<string, World>;
}

/**
 * Reads every world a config names, its `world` and each `vary.world` value (paths relative
 * to the config folder), so a broken world stops a sweep before anything runs or is written.
 * Values that are not text are left to the schema.
 */
export function checkNamedWorlds(config: { readonly world?: unknown; readonly vary?: unknown }, configDir: string): WorldCheck {
  const named: { readonly file: string; readonly at: readonly (string | number)[] }[] = [];
  if (typeof config.world === 'string') named.push({ file: config.world, at: ['world'] });
  const varied = (config.vary as { world?: unknown } | undefined)?.world;
  if (Array.isArray(varied)) varied.forEach((file, i) => { if (typeof file === 'string') named.push({ file, at: ['vary', 'world', i] }); });
  const worlds = new Map<string, World>();
  const failures = new Map<string, string[]>();
  const problems = named.flatMap(({ file, at }) => {
    const path = resolve(configDir, file);
    if (!worlds.has(path) && !failures.has(path)) {
      const read = readWorld(path);
      if (Array.isArray(read)) failures.set(path, read);
      else worlds.set(path, read);
    }
    const lines = failures.get(path);
    return lines == null ? [] : [worldProblem(at, path, lines)];
  });
  return { problems, worlds };
}

function readWorld(path: string): World | string[] {
  if (!existsSync(path) || !statSync(path).isFile()) return [];
  try {
    return readWorldFile(path);
  } catch (error) {
    if (error instanceof WorldFileError) return [...error.problems];
    throw error;
  }
}

function worldProblem(at: readonly (string | number)[], path: string, lines: readonly string[]): ConfigProblem {
  if (lines.length === 0) return { path: at, message: `world file not found: ${path}` };
  const count = `${lines.length} problem${lines.length === 1 ? '' : 's'}`;
  return { path: at, message: `the world file ${path} is invalid (${count}, listed below)`, detail: lines };
}
