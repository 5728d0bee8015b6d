import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadSweep } from '../../src/experiment/config.js';
import { planCells } from '../../src/experiment/plan.js';
import { configJsonSchema } from '../../src/experiment/schema.js';

const CONFIGS = fileURLToPath(new URL('../../configs/', import.meta.url));
const files = readdirSync(CONFIGS).filter((name) => name.endsWith('.yaml')).sort();

describe('shipped configs', () => {
  it('ship the six example sweeps', () => {
    expect(files).toEqual(['multisense.yaml', 'quickstart.yaml', 'rules.yaml', 'sound-noise.yaml', 'spiking.yaml', 'vary.yaml']);
  });

  it('spiking compares two spiking learners with their rate-MLP counterparts of the same widths and schedule under sight noise', () => {
    const settings = loadSweep(join(CONFIGS, 'spiking.yaml')).combinations[0].settings;
    const specs = settings.learners.map((l) => l.spec);
    expect(specs.map((s) => [s.name, s.objective, s.encoder.kind])).toEqual([
      ['spiking-sound-from-sight', 'predict', 'spiking'], ['spiking-sight-autoencoder', 'reconstruct', 'spiking'],
      ['sound-from-sight', 'predict', 'mlp'], ['sight-autoencoder', 'reconstruct', 'mlp'],
    ]);
    expect(new Set(specs.map((s) => JSON.stringify([s.encoder.hidden, s.train]))).size).toBe(1);
    expect(settings.noise.map((n) => `${n.channel} ${n.kind}`)).toEqual(['sight gaussian']);
  });

  it.each(files)('%s is valid and points editors at the schema', (name) => {
    const sweep = loadSweep(join(CONFIGS, name));
    expect(planCells(sweep).length).toBeGreaterThan(0);
    expect(readFileSync(join(CONFIGS, name), 'utf8').split('\n')[0]).toBe('# yaml-language-server: $schema=crosswise.schema.json');
  });

  it('quickstart has at least 5 learners, 3 seeds, 4 probe targets and sight gaussian noise at severities 0–5', () => {
    const sweep = loadSweep(join(CONFIGS, 'quickstart.yaml'));
    const settings = sweep.combinations[0].settings;
    expect(settings.learners.map((l) => l.spec.name)).toEqual(['sound-from-sight', 'touch-from-sight-and-motor', 'sight-autoencoder', 'sight-forecaster', 'untrained']);
    expect(sweep.seeds.length).toBeGreaterThanOrEqual(3);
    expect(settings.probe.targets.length).toBeGreaterThanOrEqual(4);
    expect(settings.noise).toEqual([{ channel: 'sight', kind: 'gaussian', severities: [0, 1, 2, 3, 4, 5] }]);
  });

  it('configs/crosswise.schema.json is what `crosswise schema` prints', () => {
    const stored = JSON.parse(readFileSync(join(CONFIGS, 'crosswise.schema.json'), 'utf8')) as unknown;
    expect(stored).toEqual({ ...configJsonSchema(), title: 'crosswise sweep config' });
  });
});
