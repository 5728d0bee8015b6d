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

  it('quickstart asks the question with a primary family of 6 hypotheses: 1 learner × 3 targets × 2 sight noises, 9 seeds', () => {
    const sweep = loadSweep(join(CONFIGS, 'quickstart.yaml'));
    const settings = sweep.combinations[0].settings;
    expect(settings.learners.map((l) => `${l.spec.name}${l.control ? ' (control)' : ''}`)).toEqual(['sound-from-sight', 'sight-autoencoder', 'untrained (control)']);
    expect(settings.probe.baseline).toBe('sight-autoencoder');
    expect(sweep.seeds.length).toBe(9);
    expect(settings.probe.targets.length).toBe(3);
    expect(settings.noise.map((n) => `${n.channel} ${n.kind}`)).toEqual(['sight gaussian', 'sight dropout']);
  });

  it('configs/crosswise.schema.json is what `crosswise schema` prints', () => {
    const stored = JSON.parse(readFileSync(join(CONFIGS, 'crosswise.schema.json'), 'utf8')) as unknown;
    expect(stored).toEqual({ ...configJsonSchema(), title: 'crosswise sweep config' });
  });
});
