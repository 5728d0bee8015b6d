import { parseArgs } from 'node:util';
import { ConfigError } from './config-errors.js';
import { loadSweep } from './config.js';
import type { Sweep } from './resolved-config.js';

/** A command-line mistake; the command prints it and exits with code 1. */
export class UsageError extends Error {
  override name = 'UsageError';
}

type OptionSpec = Record<string, { readonly type: 'string' | 'boolean' }>;

/** Parses `<config> [options]` for one command, rejecting unknown options and extra arguments. */
export function parseCommand<O extends OptionSpec>(command: string, args: readonly string[], options: O) {
  try {
    const parsed = parseArgs({ args: [...args], options, allowPositionals: true, strict: true });
    if (parsed.positionals.length !== 1) throw new UsageError(`expected one config file, got ${parsed.positionals.length}`);
    return { config: parsed.positionals[0], values: parsed.values };
  } catch (error) {
    throw new UsageError(`crosswise ${command}: ${(error as Error).message}`);
  }
}

/** A positive integer option, or the fallback when absent. */
export function positiveInteger(name: string, text: string | undefined, fallback: number): number {
  if (text == null) return fallback;
  const value = Number(text);
  if (!Number.isInteger(value) || value < 1) throw new UsageError(`--${name}: expected a positive integer, got '${text}'`);
  return value;
}

/**
 * Runs a command body, turning config and usage errors into their messages on stderr
 * and exit code 1.
 */
export async function withInputErrors(body: () => Promise<number>): Promise<number> {
  try {
    return await body();
  } catch (error) {
    if (error instanceof ConfigError || error instanceof UsageError) {
      console.error(error.message);
      return 1;
    }
    throw error;
  }
}

/** Loads a config, with `--out` overriding its output folder. */
export function loadSweepFrom(config: string, out: string | undefined): Sweep {
  return loadSweep(config, out == null ? {} : { out });
}
