import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** URL of the test double cell work. */
export const FAKE_WORK = new URL('./fake-cell.ts', import.meta.url).href;

const ROOT = fileURLToPath(new URL('../../', import.meta.url));

/** A small walled room of our own, enough for configs to name a world file. */
export const SHED_WORLD = `name: shed
description: A garden shed with a ticking clock.
cell_size_m: 0.5
materials:
  - { name: plank, glyph: "#", solid: true, colour: [0.5, 0.35, 0.2] }
  - { name: floor, glyph: ".", colour: [0.6, 0.6, 0.55], texture: [0.2, 0.1, 0.0, 0.0],
      footstep: { centre_hz: 800, bandwidth_octaves: 1.0, level_db: 40 } }
emitters:
  - { name: clock, glyph: C, on: floor, solid: true, colour: [0.9, 0.9, 0.8],
      centre_hz: 2000, bandwidth_octaves: 1.0, level_db: 50, period_steps: 2, duty: 0.5 }
map: |
  ######
  #..C.#
  #....#
  ######
`;

/** A fresh temporary folder holding `world.yaml` and the given config as `config.yaml`; returns the folder. */
export function configFolder(configText: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'crosswise-xp-'));
  writeFileSync(join(dir, 'world.yaml'), SHED_WORLD);
  writeFileSync(join(dir, 'config.yaml'), configText);
  return dir;
}

/** The output of a finished child process. */
export interface Finished {
  readonly code: number | null;
  readonly stdout: string;
  readonly stderr: string;
}

/**
 * Spawns `crosswise` with the fake cell work in place of the pipeline; `onLine` sees each
 * stdout line as it comes (and may kill the child).
 */
export function spawnWithFake(
  args: readonly string[],
  onLine?: (line: string, kill: () => void) => void,
  env: Record<string, string> = {},
  onSpawn?: (child: ChildProcess) => void,
): Promise<Finished> {
  const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'test/experiment/run-with-fake.ts'), ...args], {
    cwd: ROOT,
    env: { ...process.env, ...env },
  });
  onSpawn?.(child);
  let stdout = '';
  let stderr = '';
  let pending = '';
  child.stdout.on('data', (chunk: Buffer) => {
    stdout += chunk.toString();
    pending += chunk.toString();
    const lines = pending.split('\n');
    pending = lines.pop() ?? '';
    for (const line of lines) onLine?.(line, () => child.kill('SIGKILL'));
  });
  child.stderr.on('data', (chunk: Buffer) => { stderr += chunk.toString(); });
  return new Promise((resolve) => child.on('close', (code) => resolve({ code, stdout, stderr })));
}
