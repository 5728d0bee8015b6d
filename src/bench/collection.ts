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

/** Timed repeats after one untimed run of the same work (so the timed runs meet compiled code). */
const REPEATS = 3;

const median = (values: readonly number[]): number => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/** Steps per second of wall time and per CPU-second for each of REPEATS timed collections. */
function timeCollection(world: World, policy: PolicyName, steps: number): { wall: number[]; cpu: number[] } {
  const options = { policy, steps, episodeSteps: 200 };
  collect(world, options, DEFAULT_SENSE_SETTINGS, 0);
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let seed = 1; seed <= REPEATS; seed++) {
    const cpu0 = process.cpuUsage();
    const wall0 = performance.now();
    collect(world, options, DEFAULT_SENSE_SETTINGS, seed);
    wall.push(steps / ((performance.now() - wall0) / 1000));
    const used = process.cpuUsage(cpu0);
    cpu.push(steps / ((used.user + used.system) / 1e6));
  }
  return { wall, cpu };
}

/**
 * Collection throughput (steps per second of wall time, all four senses and every latent)
 * on the largest demo world, for the wander and seek policies: the median of REPEATS runs,
 * min–max in the detail. The detail gives steps per CPU-second too: on a busy machine wall
 * time overstates the cost of one step.
 */
export async function benchCollection(opts: { quick: boolean }): Promise<BenchResult[]> {
  const { world, file } = largestDemoWorld();
  const steps = opts.quick ? 20_000 : 200_000;
  const { sight, sound } = DEFAULT_SENSE_SETTINGS;
  return (['wander', 'seek'] as const).map((policy) => {
    const { wall, cpu } = timeCollection(world, policy, steps);
    return {
      name: `collection (${policy})`,
      value: Math.round(median(wall)),
      unit: 'steps/s',
      detail: `${steps} steps on ${file} (${world.width}×${world.height} cells, ${world.emitters.length} emitters), `
        + `sight ${sight.width}×${sight.depth}, ${sound.bands} sound bands, one thread, median of ${REPEATS} `
        + `(${Math.round(Math.min(...wall))}–${Math.round(Math.max(...wall))}); `
        + `${Math.round(median(cpu))} steps per CPU-second`,
    };
  });
}
