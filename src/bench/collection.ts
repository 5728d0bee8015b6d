import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { collect } from '../collect/collector.js';
import type { PolicyName } from '../collect/policies.js';
import { DEFAULT_SENSE_SETTINGS } from '../senses/channel.js';
import { loadWorld } from '../world/parse.js';
import type { World } from '../world/types.js';
import type { BenchResult } from './result.js';

const WORLDS_DIR = fileURLToPath(new URL('../../worlds/', import.meta.url));

/** The demo world with the most cells (the hardest case for sound tables and sight). */
function largestDemoWorld(): { world: World; file: string } {
  const files = readdirSync(WORLDS_DIR).filter((f) => f.endsWith('.yaml')).sort();
  const worlds = files.map((file) => ({ file, world: loadWorld(WORLDS_DIR + file) }));
  return worlds.reduce((a, b) => (b.world.width * b.world.height > a.world.width * a.world.height ? b : a));
}

function timeCollection(world: World, policy: PolicyName, steps: number): { wallS: number; cpuS: number } {
  const options = { policy, steps, episodeSteps: 200 };
  collect(world, { ...options, steps: Math.min(steps, 5000) }, DEFAULT_SENSE_SETTINGS, 0); // warm up the JIT
  const cpu0 = process.cpuUsage();
  const wall0 = performance.now();
  collect(world, options, DEFAULT_SENSE_SETTINGS, 1);
  const wallS = (performance.now() - wall0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  return { wallS, cpuS: (cpu.user + cpu.system) / 1e6 };
}

/**
 * Collection throughput (steps per second of wall time, all four senses and every latent)
 * on the largest demo world, for the wander and seek policies. The detail gives CPU time too:
 * on a busy machine wall time overstates the cost of one step.
 */
export async function benchCollection(opts: { quick: boolean }): Promise<BenchResult[]> {
  const { world, file } = largestDemoWorld();
  const steps = opts.quick ? 20_000 : 200_000;
  const { sight, sound } = DEFAULT_SENSE_SETTINGS;
  return (['wander', 'seek'] as const).map((policy) => {
    const { wallS, cpuS } = timeCollection(world, policy, steps);
    return {
      name: `collection (${policy})`,
      value: Math.round(steps / wallS),
      unit: 'steps/s',
      detail: `${steps} steps on ${file} (${world.width}×${world.height} cells, ${world.emitters.length} emitters), `
        + `sight ${sight.width}×${sight.depth}, ${sound.bands} sound bands, one thread; `
        + `${Math.round(steps / cpuS)} steps per CPU-second`,
    };
  });
}
