import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
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
    const text = `{"format_version":2,"identity":${canonicalJson(identity)}}`;
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
});
