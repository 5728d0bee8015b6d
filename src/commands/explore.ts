import { readdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_SENSE_SETTINGS } from '../senses/channel.js';
import { readWorldFile, worldFileProblems } from '../experiment/file-kind.js';
import { runAction } from './command-line.js';
import { CONFIG_HINT, configWorldAndSenses } from './config-senses.js';
import { EXIT } from './exit-codes.js';
import { exploreUsage } from './explore-usage.js';
import { UsageError } from './usage.js';

const DEMO_DIR = fileURLToPath(new URL('../../worlds/', import.meta.url));
const DEFAULT_WORLD = 'greenhouse.yaml';

/** The demo worlds shipped in worlds/, by absolute path, sorted by name. */
function demoWorldPaths(): string[] {
  return readdirSync(DEMO_DIR).filter((f) => f.endsWith('.yaml')).sort().map((f) => resolve(DEMO_DIR, f));
}

/** `crosswise explore`: walk a world with every sense drawn live; other demo worlds are a key away (see explore-usage.ts). */
export async function exploreCommand(args: readonly string[]): Promise<number> {
  return runAction(exploreUsage, args, async ({ operands: [world], values }) => {
    const chosen = values.config == null
      ? { worldPath: world ?? resolve(DEMO_DIR, DEFAULT_WORLD), senses: DEFAULT_SENSE_SETTINGS }
      : configWorldAndSenses(values.config);
    const first = resolve(chosen.worldPath);
    const opened = readWorldFile(first, CONFIG_HINT);
    if (!process.stdin.isTTY) throw new UsageError('needs an interactive terminal (stdin is not a TTY)');
    const others = demoWorldPaths().filter((p) => p !== first && worldFileProblems(p).length === 0);
    const worlds = [opened, ...others.map((path) => readWorldFile(path))];
    const colour = process.env.NO_COLOR == null || process.env.NO_COLOR === '';
    // Imported here: Ink and React take a while to load, and only the app needs them.
    const { renderExplore } = await import('../tui/explore/render-explore.js');
    await renderExplore({ worlds, seed: values.seed, colour, settings: chosen.senses }).waitUntilExit();
    return EXIT.success;
  });
}
