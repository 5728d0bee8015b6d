import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { collect } from '../collect/collector.js';
import { LATENT_KIND } from '../collect/dataset.js';
import { splitByEpisode } from '../collect/split.js';
import { encodeNpy } from '../results/npy.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS } from '../senses/channel.js';
import { loadWorld } from '../world/parse.js';
import { figureOf, wallSeconds, type Figure } from './figure.js';
import { findPython, ONE_THREAD } from './python.js';

const SCRIPT = fileURLToPath(new URL('./peer-quickstart.py', import.meta.url));
const WORLD = fileURLToPath(new URL('../../worlds/greenhouse.yaml', import.meta.url));

// What the fixed quickstart (quickstart-15.yaml) collects and probes: its seeds and
// targets, and the documented defaults for everything it leaves out.
const SEEDS = [1, 2, 3];
const TARGETS = ['wall_ahead', 'material_ahead', 'nearest_emitter', 'nearest_distance_m', 'heading'] as const;
const COLLECT = { policy: 'wander', steps: 20_000, episodeSteps: 200 } as const;
const SPLIT = { train: 0.7, validation: 0.15, test: 0.15 };

const npy = (values: ArrayLike<number>, shape: number[]) => encodeNpy(Float32Array.from(values), shape);

/**
 * Writes each seed's experience as crosswise collects it for the quickstart, as .npy files in
 * `dir/seed-<s>/`: every channel [steps, width], the probe targets and has_next [steps], and
 * the episode split's step indices; plus `targets.json` naming each target's kind.
 */
export function exportQuickstartData(dir: string): void {
  const world = loadWorld(WORLD);
  for (const seed of SEEDS) {
    const data = collect(world, COLLECT, DEFAULT_SENSE_SETTINGS, seed);
    const split = splitByEpisode(data, SPLIT, seed);
    const folder = join(dir, `seed-${seed}`);
    mkdirSync(folder, { recursive: true });
    const files: [string, Uint8Array][] = [
      ...CHANNELS.map((c): [string, Uint8Array] => [c, npy(data.channels[c], [data.steps, data.channelSize[c]])]),
      ...TARGETS.map((t): [string, Uint8Array] => [t, npy(data.latents[t], [data.steps])]),
      ['has_next', npy(data.hasNext, [data.steps])],
      ...(['train', 'validation', 'test'] as const).map((s): [string, Uint8Array] => [`split_${s}`, npy(split[s], [split[s].length])]),
    ];
    for (const [name, bytes] of files) writeFileSync(join(folder, `${name}.npy`), bytes);
  }
  writeFileSync(join(dir, 'targets.json'), JSON.stringify({ seeds: SEEDS, targets: Object.fromEntries(TARGETS.map((t) => [t, LATENT_KIND[t]])) }));
}

/**
 * Wall time of the peer script (peer-quickstart.py: the quickstart's 15 cells written as a
 * PyTorch + scikit-learn user would, two worker processes of one thread each) on the same
 * experience crosswise collects; one warm-up run first. Null when no Python imports torch,
 * sklearn and numpy.
 */
export async function benchPeer(repeats: number): Promise<Figure | null> {
  const python = findPython(['torch', 'sklearn', 'numpy']);
  if (python == null) return null;
  const dir = mkdtempSync(join(tmpdir(), 'crosswise-peer-'));
  try {
    exportQuickstartData(dir);
    const runOnce = () => wallSeconds(() => {
      const run = spawnSync(python, [SCRIPT, dir, '--workers', '2'], { encoding: 'utf8', env: { ...process.env, ...ONE_THREAD } });
      if (run.status !== 0) throw new Error(`peer-quickstart.py failed: ${run.stderr.trim().split('\n').pop()}`);
    });
    await runOnce();
    const times: number[] = [];
    for (let r = 0; r < repeats; r++) times.push(await runOnce());
    return figureOf(times);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
