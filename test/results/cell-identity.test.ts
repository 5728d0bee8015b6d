import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { RESULTS_FORMAT_VERSION } from '../../src/results/format-version.js';
import { canonicalJson, cellId, cellIdentity, type CellSettings } from '../../src/results/cell-identity.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';

// Test data: the settings of an invented cell.
const settings: CellSettings = {
  learner: {
    name: 'sight-autoencoder', objective: 'reconstruct', input: ['sight'], target: [], offset: 0, supervisedTargets: [],
    encoder: { hidden: [64], activation: 'relu' }, rule: 'backprop',
    train: { optimizer: 'adam', learningRate: 0.001, batch: 256, epochs: 10, patience: 3, temperature: 0.1 },
  },
  seed: 1,
  worldSha256: '0'.repeat(64),
  collect: { policy: 'wander', steps: 1000, episodeSteps: 200, split: { train: 0.7, validation: 0.15, test: 0.15 } },
  senses: DEFAULT_SENSE_SETTINGS,
  probeTargets: ['wall_ahead'],
  noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 3] }],
  vary: {},
};

describe('canonical JSON', () => {
  it('sorts object keys at every level and leaves out undefined members', () => {
    expect(canonicalJson({ b: 1, a: [{ d: 2, c: 3 }], e: undefined })).toBe('{"a":[{"c":3,"d":2}],"b":1}');
  });
});

describe('cell id', () => {
  it('is the first 10 hex digits of the SHA-256 of the canonical JSON of the format version and the identity', () => {
    const identity = cellIdentity(settings);
    const text = `{"format_version":${RESULTS_FORMAT_VERSION},"identity":${canonicalJson(identity)}}`;
    expect(cellId(identity)).toBe(createHash('sha256').update(text).digest('hex').slice(0, 10));
    expect(cellId(identity)).toMatch(/^[0-9a-f]{10}$/);
  });

  it('spells the identity like the config file (snake_case)', () => {
    const identity = cellIdentity(settings);
    expect(identity.collect).toEqual({ policy: 'wander', steps: 1000, episode_steps: 200, split: { train: 0.7, validation: 0.15, test: 0.15 } });
    expect(identity.learner.train).toEqual({ optimizer: 'adam', learning_rate: 0.001, batch: 256, epochs: 10, patience: 3, temperature: 0.1 });
    expect(identity.senses.sound).toEqual({ bands: 16, min_hz: 100, max_hz: 8000 });
  });

  it('depends on the learner name but not on the order settings were written in', () => {
    const renamed = cellIdentity({ ...settings, learner: { ...settings.learner, name: 'sight-autoencoder-2' } });
    expect(cellId(renamed)).not.toBe(cellId(cellIdentity(settings)));
    const reordered = cellIdentity({ ...settings, collect: { split: settings.collect.split, episodeSteps: 200, steps: 1000, policy: 'wander' } });
    expect(cellId(reordered)).toBe(cellId(cellIdentity(settings)));
  });

  it('keeps an MLP encoder\'s identity as it was before encoder kinds (no kind key), so its cells keep their ids', () => {
    const explicit = cellIdentity({ ...settings, learner: { ...settings.learner, encoder: { kind: 'mlp', hidden: [64], activation: 'relu' } } });
    expect(explicit.learner.encoder).toEqual({ hidden: [64], activation: 'relu' });
    expect(cellId(explicit)).toBe(cellId(cellIdentity(settings)));
  });

  it('holds every setting of a spiking encoder, in config spelling, and each changes the id', () => {
    const encoder = {
      kind: 'spiking', hidden: [64], steps: 16, dtMs: 1, tauMs: 2, threshold: 1, reset: 'subtract', refractoryMs: 0,
      inputCoding: 'current', surrogate: 'fast-sigmoid', surrogateSlope: 5,
    } as const;
    const identity = cellIdentity({ ...settings, learner: { ...settings.learner, encoder } });
    expect(identity.learner.encoder).toEqual({
      kind: 'spiking', hidden: [64], steps: 16, dt_ms: 1, tau_ms: 2, threshold: 1, reset: 'subtract', refractory_ms: 0,
      input_coding: 'current', surrogate: 'fast-sigmoid', surrogate_slope: 5,
    });
    const ids = new Set([identity, ...[{ steps: 8 }, { tauMs: 3 }, { reset: 'zero' }, { inputCoding: 'poisson' }, { surrogate: 'arctan' }, { surrogateSlope: 2 }]
      .map((change) => cellIdentity({ ...settings, learner: { ...settings.learner, encoder: { ...encoder, ...change } as typeof encoder } }))].map(cellId));
    expect(ids.size).toBe(7);
  });
});
