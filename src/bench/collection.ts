import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { collect } from '../collect/collector.js';
import { DEFAULT_SENSE_SETTINGS } from '../senses/channel.js';
import { loadWorld } from '../world/parse.js';
import type { World } from '../world/types.js';
import { measure, wallSeconds, type Figure } from './figure.js';

const WORLDS_DIR = fileURLToPath(new URL('../../worlds/', import.meta.url));

/** The demo world with the most cells (the hardest case for sound tables and sight). */
function largestDemoWorld(): { world: World; file: string } {
  const files = readdirSync(WORLDS_DIR).filter((f) => f.endsWith('.yaml')).sort();
  const worlds = files.map((file) => ({ file, world: loadWorld(WORLDS_DIR + file) }));
  return worlds.reduce((a, b) => (b.world.width * b.world.height > a.world.width * a.world.height ? b : a));
}

/**
 * Collection throughput in steps per second of wall time (wander policy, all four senses
 * and every latent, one thread) on the largest demo world.
 */
export async function benchCollection(repeats: number, quick: boolean): Promise<{ figure: Figure; detail: string }> {
  const { world, file } = largestDemoWorld();
  const steps = quick ? 20_000 : 200_000;
  let seed = 0;
  const figure = await measure(repeats, async () => steps / await wallSeconds(() => collect(world, { policy: 'wander', steps, episodeSteps: 200 }, DEFAULT_SENSE_SETTINGS, seed++)));
  const { sight, sound } = DEFAULT_SENSE_SETTINGS;
  return { figure, detail: `${steps} wander steps on ${file} (${world.width}×${world.height} cells), sight ${sight.width}×${sight.depth}, ${sound.bands} sound bands, one thread` };
}
