import { readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { checkCommand } from '../../src/commands/check.js';
import { clusterCommand } from '../../src/commands/cluster.js';
import { planCommand } from '../../src/commands/plan.js';
import { runCommand } from '../../src/commands/run.js';
import { configFolder, FAKE_WORK, SHED_WORLD } from '../experiment/helpers.js';

const CONFIG = `name: broken-world
world: world.yaml
seeds: [1]
learners:
  - { name: untrained, objective: untrained, input: [sight] }
out: out
`;

/** The shed with an unknown glyph X at x=1, y=1 (line 13, column 4 of the file). */
const BROKEN_WORLD = SHED_WORLD.replace('#..C.#', '#X.C.#');

type Command = (args: readonly string[]) => Promise<number>;
const COMMANDS: readonly (readonly [string, Command])[] = [
  ['check', checkCommand],
  ['plan', planCommand],
  ['run', (args) => runCommand([...args, '--plain'], { workModule: FAKE_WORK })],
  ['cluster', (args) => clusterCommand([...args, '--out', join(args[0], '..', 'out')])],
];

/** Runs a command on a config whose world is broken; returns its exit code, stderr lines and the folder's files afterwards. */
async function attempt(command: Command, configText: string, world: string) {
  const dir = configFolder(configText);
  writeFileSync(join(dir, 'world.yaml'), world);
  const errors: string[] = [];
  vi.spyOn(console, 'error').mockImplementation((line: string) => { errors.push(...line.split('\n')); });
  vi.spyOn(console, 'log').mockImplementation(() => undefined);
  const code = await command([join(dir, 'config.yaml')]);
  return { dir, code, errors, files: readdirSync(dir).sort() };
}

describe('a config whose world is broken is rejected before anything runs', () => {
  afterEach(() => vi.restoreAllMocks());

  it.each(COMMANDS)('%s: exit 1, the world\'s located error, nothing written', async (name, command) => {
    const { dir, code, errors, files } = await attempt(command, CONFIG, BROKEN_WORLD);
    expect(code).toBe(1);
    expect(errors).toEqual([
      `crosswise ${name}: ${dir}/config.yaml:2:8: world: the world file ${dir}/world.yaml is invalid (1 problem, listed below)`,
      `crosswise ${name}: ${dir}/world.yaml:13:4: map: unknown glyph "X" at x=1, y=1: not a material or emitter glyph`,
    ]);
    expect(files).toEqual(['config.yaml', 'world.yaml']);
  });

  it('checks every world of a vary list, each at its entry', async () => {
    const text = `${CONFIG}vary:\n  world: [world.yaml, missing.yaml]\n`;
    const { dir, code, errors, files } = await attempt(planCommand, text, SHED_WORLD);
    expect(code).toBe(1);
    expect(errors).toEqual([`crosswise plan: ${dir}/config.yaml:8:23: vary.world.1: world file not found: ${dir}/missing.yaml`]);
    expect(files).toEqual(['config.yaml', 'world.yaml']);
  });
});
