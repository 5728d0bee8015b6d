import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cellIdentity, type CellSettings } from '../../src/results/cell-identity.js';
import {
  armIdentity, experimentConflict, extendExperiment, formatExperimentRecord, readFolderOwner, type ExperimentRecord,
} from '../../src/results/experiment-record.js';
import { RESULTS_FORMAT_VERSION } from '../../src/results/format-version.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { scratchFolders } from '../scratch.js';

// Test data: the settings of invented cells.
const base: CellSettings = {
  learner: {
    name: 'sound-from-sight', objective: 'predict', input: ['sight'], target: ['sound'], offset: 0, supervisedTargets: [],
    encoder: { hidden: [128, 64], activation: 'relu' }, rule: 'backprop',
    train: { optimizer: 'adam', learningRate: 0.001, batch: 256, epochs: 10, patience: 3, temperature: 0.1 },
  },
  seed: 1,
  worldSha256: 'ab'.repeat(32),
  collect: { policy: 'wander', steps: 2000, episodeSteps: 200, split: { train: 0.7, validation: 0.15, test: 0.15 } },
  senses: DEFAULT_SENSE_SETTINGS,
  probeTargets: ['wall_ahead'],
  noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 2] }],
  vary: { 'collect.steps': '2000' },
};
const arm = (settings: Partial<CellSettings>) => armIdentity(cellIdentity({ ...base, ...settings }));
const experiment = (...arms: ExperimentRecord['arms']): ExperimentRecord => ({ format_version: RESULTS_FORMAT_VERSION, vary_keys: ['collect.steps'], arms });
const autoencoder = { ...base.learner, name: 'sight-autoencoder', objective: 'reconstruct' as const, target: [] };

describe('experiment identity', () => {
  it('leaves the seed out of an arm, so added seeds extend the same experiment', () => {
    expect(arm({ seed: 1 })).toEqual(arm({ seed: 7 }));
    expect(experimentConflict(experiment(arm({ seed: 1 })), experiment(arm({ seed: 2 })))).toBeNull();
  });

  it('takes added learners and vary values as an extension and keeps the stored arms first', () => {
    const stored = experiment(arm({}));
    const grown = experiment(arm({}), arm({ learner: autoencoder }), arm({ vary: { 'collect.steps': '4000' }, collect: { ...base.collect, steps: 4000 } }));
    expect(experimentConflict(stored, grown)).toBeNull();
    expect(extendExperiment(stored, grown).arms).toEqual(grown.arms);
    // A smaller sweep into the same folder keeps the arms it leaves out.
    expect(extendExperiment(grown, stored).arms).toEqual(grown.arms);
  });

  it('names the first setting that differs when an arm changes', () => {
    const changed = { ...base.learner, encoder: { hidden: [64], activation: 'relu' as const } };
    expect(experimentConflict(experiment(arm({})), experiment(arm({ learner: changed }))))
      .toBe("learner 'sound-from-sight' (collect.steps=2000) has other settings there: learner.encoder.hidden: [64] here, [128,64] there");
    expect(experimentConflict(experiment(arm({})), experiment(arm({ worldSha256: 'cd'.repeat(32) }))))
      .toBe(`learner 'sound-from-sight' (collect.steps=2000) has other settings there: world_sha256: "${'cd'.repeat(32)}" here, "${'ab'.repeat(32)}" there`);
  });

  it('calls other vary keys another experiment', () => {
    expect(experimentConflict(experiment(arm({})), { ...experiment(arm({ vary: {} })), vary_keys: [] }))
      .toBe("its vary keys are collect.steps, this config's (none)");
  });
});

describe('readFolderOwner', () => {
  const folder = scratchFolders('crosswise-owner-');

  it('finds no owner in an empty or new folder', () => {
    expect(readFolderOwner(folder())).toEqual({ kind: 'none' });
    expect(readFolderOwner(join(folder(), 'not-yet'))).toEqual({ kind: 'none' });
  });

  it('reads the experiment back as written', () => {
    const dir = folder();
    const record = experiment(arm({}));
    writeFileSync(join(dir, 'experiment.json'), formatExperimentRecord(record));
    expect(readFolderOwner(dir)).toEqual({ kind: 'experiment', record });
  });

  it('tells a folder of a format before experiment.json (cells or plan.csv, no experiment.json) and one of another version', () => {
    const old = folder();
    mkdirSync(join(old, 'cells', '0123456789'), { recursive: true });
    expect(readFolderOwner(old)).toEqual({ kind: 'other-format', version: null });
    const newer = folder();
    writeFileSync(join(newer, 'experiment.json'), `{"format_version": ${RESULTS_FORMAT_VERSION + 1}}\n`);
    expect(readFolderOwner(newer)).toEqual({ kind: 'other-format', version: RESULTS_FORMAT_VERSION + 1 });
  });

  it('says why an experiment.json cannot be read', () => {
    const dir = folder();
    writeFileSync(join(dir, 'experiment.json'), `{"format_version": ${RESULTS_FORMAT_VERSION}, "vary_keys": "x"`);
    expect(readFolderOwner(dir)).toMatchObject({ kind: 'unreadable', reason: expect.stringMatching(/^experiment\.json: /) });
  });
});
