import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { checkCommand } from '../../src/commands/check.js';
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
    expect(await checkCommand([join(dir, 'config.yaml')])).toBe(0);
    expect(lines).toEqual([`${join(dir, 'config.yaml')}: ok (config)`]);
  });

  it('prints each config problem with file, line, column and key, and exits 1', async () => {
    const dir = configFolder(CONFIG.replace('objective: reconstruct', 'objective: reconstrut'));
    const errors: string[] = [];
    vi.spyOn(console, 'error').mockImplementation((line: string) => { errors.push(line); });
    expect(await checkCommand([join(dir, 'config.yaml')])).toBe(1);
    expect(errors).toEqual([
      `crosswise check: ${join(dir, 'config.yaml')}:4:43: learners.0.objective: expected one of predict | reconstruct | forecast | contrast | supervised | untrained, got 'reconstrut' (did you mean 'reconstruct'?)`,
    ]);
  });
});
