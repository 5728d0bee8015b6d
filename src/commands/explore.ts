import { readdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { renderExplore } from '../tui/explore/render-explore.js';
import { checkWorldFile, loadWorld } from '../world/parse.js';

const DEMO_DIR = fileURLToPath(new URL('../../worlds/', import.meta.url));
const DEFAULT_WORLD = 'greenhouse.yaml';
const USAGE = 'usage: crosswise explore [world] [--seed N]';

/** Parsed command line of `explore`, or the one-line reason it is wrong. */
export function parseExploreArgs(args: readonly string[]): { world: string; seed: number } | { error: string } {
  let world: string | null = null;
  let seed = 1;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '--seed') {
      const value = args[++i];
      if (value == null || !/^-?\d+$/.test(value)) return { error: `explore: --seed needs an integer, got ${value ?? 'nothing'}` };
      seed = Number(value);
    } else if (arg.startsWith('-')) {
      return { error: `explore: unknown option '${arg}'; ${USAGE}` };
    } else if (world == null) {
      world = arg;
    } else {
      return { error: `explore: one world at a time, got '${world}' and '${arg}'; ${USAGE}` };
    }
  }
  return { world: world ?? resolve(DEMO_DIR, DEFAULT_WORLD), seed };
}

/** The demo worlds shipped in worlds/, by absolute path, sorted by name. */
function demoWorldPaths(): string[] {
  return readdirSync(DEMO_DIR).filter((f) => f.endsWith('.yaml')).sort().map((f) => resolve(DEMO_DIR, f));
}

/** `crosswise explore`: walk a world with every sense drawn live; other demo worlds are a key away. */
export async function exploreCommand(args: readonly string[]): Promise<number> {
  const parsed = parseExploreArgs(args);
  if ('error' in parsed) {
    console.error(parsed.error);
    return 1;
  }
  const problems = checkWorldFile(parsed.world);
  if (problems.length > 0) {
    for (const line of problems) console.error(line);
    return 1;
  }
  if (!process.stdin.isTTY) {
    console.error('explore: needs an interactive terminal (stdin is not a TTY)');
    return 1;
  }
  const first = resolve(parsed.world);
  const others = demoWorldPaths().filter((p) => p !== first && checkWorldFile(p).length === 0);
  const worlds = [first, ...others].map((path) => loadWorld(path));
  const colour = process.env.NO_COLOR == null || process.env.NO_COLOR === '';
  await renderExplore({ worlds, seed: parsed.seed, colour }).waitUntilExit();
  return 0;
}
