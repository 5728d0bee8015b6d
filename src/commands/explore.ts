import { readdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ConfigError } from '../experiment/config-errors.js';
import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';
import { renderExplore } from '../tui/explore/render-explore.js';
import { checkWorldFile, loadWorld } from '../world/parse.js';
import { configWorldAndSenses } from './config-senses.js';

const DEMO_DIR = fileURLToPath(new URL('../../worlds/', import.meta.url));
const DEFAULT_WORLD = 'greenhouse.yaml';
const USAGE = 'usage: crosswise explore [world | --config FILE] [--seed N]';

/** Parsed command line of `explore`, or the one-line reason it is wrong. */
export function parseExploreArgs(args: readonly string[]): { world: string | null; config: string | null; seed: number } | { error: string } {
  let world: string | null = null;
  let config: string | null = null;
  let seed = 1;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--seed') {
      const value = args[++i];
      if (value == null || !/^-?\d+$/.test(value)) return { error: `explore: --seed needs an integer, got ${value ?? 'nothing'}` };
      seed = Number(value);
    } else if (arg === '--config') {
      const value = args[++i];
      if (value == null || value.startsWith('-')) return { error: `explore: --config needs a config file; ${USAGE}` };
      config = value;
    } else if (arg.startsWith('-')) {
      return { error: `explore: unknown option '${arg}'; ${USAGE}` };
    } else if (world == null) {
      world = arg;
    } else {
      return { error: `explore: one world at a time, got '${world}' and '${arg}'; ${USAGE}` };
    }
  }
  if (world != null && config != null) return { error: `explore: give a world or --config, not both; ${USAGE}` };
  return { world: config == null ? world ?? resolve(DEMO_DIR, DEFAULT_WORLD) : null, config, seed };
}

/** The demo worlds shipped in worlds/, by absolute path, sorted by name. */
function demoWorldPaths(): string[] {
  return readdirSync(DEMO_DIR).filter((f) => f.endsWith('.yaml')).sort().map((f) => resolve(DEMO_DIR, f));
}

/** The world to open and the sense settings, from the command line or a config; the lines to print when invalid. */
function chosenWorld(parsed: { world: string | null; config: string | null }): { path: string; senses: SenseSettings } | { problems: readonly string[] } {
  if (parsed.config == null) return { path: parsed.world as string, senses: DEFAULT_SENSE_SETTINGS };
  try {
    const { worldPath, senses } = configWorldAndSenses(parsed.config);
    return { path: worldPath, senses };
  } catch (error) {
    if (error instanceof ConfigError) return { problems: error.lines };
    throw error;
  }
}

/** `crosswise explore`: walk a world with every sense drawn live; other demo worlds are a key away. */
export async function exploreCommand(args: readonly string[]): Promise<number> {
  const parsed = parseExploreArgs(args);
  if ('error' in parsed) {
    console.error(parsed.error);
    return 1;
  }
  const chosen = chosenWorld(parsed);
  const problems = 'problems' in chosen ? chosen.problems : checkWorldFile(chosen.path);
  if (problems.length > 0 || 'problems' in chosen) {
    for (const line of problems) console.error(line);
    return 1;
  }
  if (!process.stdin.isTTY) {
    console.error('explore: needs an interactive terminal (stdin is not a TTY)');
    return 1;
  }
  const first = resolve(chosen.path);
  const others = demoWorldPaths().filter((p) => p !== first && checkWorldFile(p).length === 0);
  const worlds = [first, ...others].map((path) => loadWorld(path));
  const colour = process.env.NO_COLOR == null || process.env.NO_COLOR === '';
  await renderExplore({ worlds, seed: parsed.seed, colour, settings: chosen.senses }).waitUntilExit();
  return 0;
}
