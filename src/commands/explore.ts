import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Recording } from '../results/recording.js';
import { DEFAULT_SENSE_SETTINGS } from '../senses/channel.js';
import { readWorldFile, worldFileProblems } from '../experiment/file-kind.js';
import { parseWorld } from '../world/parse.js';
import type { World } from '../world/types.js';
import { runAction } from './command-line.js';
import { CONFIG_HINT, configWorldAndSenses } from './config-senses.js';
import { EXIT } from './exit-codes.js';
import { exploreUsage } from './explore-usage.js';
import { readReplayFolder } from './replay-folder.js';
import { UsageError } from './usage.js';

const DEMO_DIR = fileURLToPath(new URL('../../worlds/', import.meta.url));
const DEFAULT_WORLD = 'greenhouse.yaml';

/** The demo worlds shipped in worlds/, by absolute path, sorted by name. */
function demoWorldPaths(): string[] {
  return readdirSync(DEMO_DIR).filter((f) => f.endsWith('.yaml')).sort().map((f) => resolve(DEMO_DIR, f));
}

/** `crosswise explore`: walk a world with every sense drawn live, or replay a recording (see explore-usage.ts). */
export async function exploreCommand(args: readonly string[]): Promise<number> {
  return runAction(exploreUsage, args, async ({ operands: [world], values }) => {
    const colour = process.env.NO_COLOR == null || process.env.NO_COLOR === '';
    if (values.replay != null) {
      if (values.config != null) throw new UsageError("--replay shows the recording's own world and senses: drop --config");
      const replay = loadReplay(values.replay);
      requireTerminal();
      const { renderReplay } = await import('../tui/explore/render-explore.js');
      await renderReplay({ ...replay, seed: values.seed, colour }).waitUntilExit();
      return EXIT.success;
    }
    const chosen = values.config == null
      ? { worldPath: world ?? resolve(DEMO_DIR, DEFAULT_WORLD), senses: DEFAULT_SENSE_SETTINGS }
      : configWorldAndSenses(values.config);
    const first = resolve(chosen.worldPath);
    const opened = readWorldFile(first, CONFIG_HINT);
    requireTerminal();
    const others = demoWorldPaths().filter((p) => p !== first && worldFileProblems(p).length === 0);
    const worlds = [opened, ...others.map((path) => readWorldFile(path))];
    // Imported here: Ink and React take a while to load, and only the app needs them.
    const { renderExplore } = await import('../tui/explore/render-explore.js');
    await renderExplore({ worlds, seed: values.seed, colour, settings: chosen.senses }).waitUntilExit();
    return EXIT.success;
  });
}

function requireTerminal(): void {
  if (!process.stdin.isTTY) throw new UsageError('needs an interactive terminal (stdin is not a TTY)');
}

/** A recording and the world it was made in, which must be byte for byte the file it names. */
export function loadReplay(dir: string): { readonly recording: Recording; readonly world: World } {
  const recording = readReplayFolder(dir);
  const { file, sha256 } = recording.manifest.world;
  if (!existsSync(file)) throw new UsageError(`--replay: the recording's world file ${file} is missing`);
  const bytes = readFileSync(file);
  if (createHash('sha256').update(bytes).digest('hex') !== sha256) {
    throw new UsageError(`--replay: the world file ${file} has changed since it was recorded (its sha256 differs from the manifest's)`);
  }
  return { recording, world: parseWorld(bytes.toString('utf8'), file) };
}
