import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { checkCommand } from '../../src/commands/check.js';
import { planCommand } from '../../src/commands/plan.js';
import { configFolder } from '../experiment/helpers.js';

const CONFIG = `name: checked
world: world.yaml
learners:
  - { name: sight-autoencoder, objective: reconstruct, input: [sight] }
`;

describe('crosswise check on config files', () => {
  afterEach(() => vi.restoreAllMocks());

  it('says ok for a valid config and writes nothing', async () => {
    const dir = configFolder(CONFIG);
    const lines: string[] = [];
    vi.spyOn(console, 'log').mockImplementation((line: string) => { lines.push(line); });
    vi.spyOn(console, 'error').mockImplementation(() => undefined);
    expect(await checkCommand([join(dir, 'config.yaml')])).toBe(0);
    // The default targets include nearest_emitter, which the one-emitter shed cannot vary.
    expect(lines).toEqual([`${join(dir, 'config.yaml')}: ok (config, 1 warning)`]);
  });

  it('prints each config problem with file, line, column and key, and exits 1', async () => {
    const dir = configFolder(CONFIG.replace('objective: reconstruct', 'objective: reconstrut'));
    const errors: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((line: string) => { errors.push(line); });
    expect(await checkCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(errors).toEqual([
      `crosswise check: ${join(dir, 'config.yaml')}:4:43: learners.0 (sight-autoencoder).objective: expected one of predict | reconstruct | forecast | contrast | supervised | untrained, got 'reconstrut' (did you mean 'reconstruct'?)`,
    ]);
  });

  it('check and plan reject a noise parameter out of range before any cell runs, writing nothing', async () => {
    const dir = configFolder(`${CONFIG}noise:\n  - { channel: sight, kind: dropout, severities: [0, 1], parameters: [0, 1.5] }\nout: out\n`);
    const config = join(dir, 'config.yaml');
    const problem = `${config}:6:74: noise.0.parameters.1: expected a fraction p in [0, 1], got 1.5`;
    const errors: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((line: string) => { errors.push(...line.split('\n')); });
    vi.spyOn(console, 'log').mockImplementation(() => undefined);
    expect(await checkCommand([config])).toBe(1);
    expect(errors).toEqual([`crosswise check: ${problem}`]);
    errors.length = 0;
    expect(await planCommand([config])).toBe(1);
    expect(errors).toEqual([`crosswise plan: ${problem}`]);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });
});
