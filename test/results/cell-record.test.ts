import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { commitCellFolder } from '../../src/results/cell-folder.js';
import { cellId, cellIdentity, type CellSettings } from '../../src/results/cell-identity.js';
import { RESULTS_FORMAT_VERSION } from '../../src/results/format-version.js';
import { formatCellRecord, parseCellRecord, readCellRecord, type CellRecord } from '../../src/results/cell-record.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';

// Test data: the settings of an invented cell.
const settings: CellSettings = {
  learner: {
    name: 'sound-from-sight', objective: 'predict', input: ['sight'], target: ['sound'], offset: 0, supervisedTargets: [],
    encoder: { hidden: [128, 64], activation: 'relu' }, rule: 'feedback-alignment',
    train: { optimizer: 'adam', learningRate: 0.001, batch: 256, epochs: 10, patience: 3, temperature: 0.1 },
  },
  seed: 3,
  worldSha256: 'ab'.repeat(32),
  collect: { policy: 'wander', steps: 20000, episodeSteps: 200, split: { train: 0.7, validation: 0.15, test: 0.15 } },
  senses: DEFAULT_SENSE_SETTINGS,
  probeTargets: ['wall_ahead', 'heading'],
  noise: [{ channel: 'sound', kind: 'masking', severities: [0, 2], parameters: [0, 7.5] }],
  vary: { 'learners.*.encoder.hidden': '[128,64]' },
};
const identity = cellIdentity(settings);
const record: CellRecord = {
  format_version: RESULTS_FORMAT_VERSION, id: cellId(identity), index: 4, status: 'done', reason: '', identity, backend: 'wasm',
  world_path: '/worlds/greenhouse.yaml', output: { save_features: true, align_every: 25 },
  seconds: { collect: 0.5, train: 2.25, probe: 1, total: 3.75 }, versions: { node: '20.20.2', crosswise: '0.1.0', tfjs: '4.22.0' },
  finished_at: '2026-01-02T03:04:05.000Z',
};

describe('cell.json', () => {
  const dirs: string[] = [];
  afterEach(() => { for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true }); });

  it('spells every key in snake_case like the config and carries the format version', () => {
    const text = formatCellRecord(record);
    const keys = [...text.matchAll(/"([^"]+)":/g)].map((m) => m[1]).filter((key) => !key.includes('.'));
    expect(keys.filter((key) => /[A-Z]/.test(key))).toEqual([]);
    expect(keys).toEqual(expect.arrayContaining(['format_version', 'learning_rate', 'episode_steps', 'min_hz', 'supervised_targets', 'save_features', 'align_every']));
    expect(JSON.parse(text)).toMatchObject({ format_version: RESULTS_FORMAT_VERSION, identity: { learner: { train: { learning_rate: 0.001 } } } });
  });

  it('reads back exactly the record that was written, through a stored cell folder', () => {
    const out = mkdtempSync(join(tmpdir(), 'crosswise-record-'));
    dirs.push(out);
    commitCellFolder(out, record.id, { 'cell.json': formatCellRecord(record) });
    expect(readCellRecord(out, record.id)).toEqual(record);
  });

  it('rejects another format version, naming the file and the key', () => {
    const text = formatCellRecord({ ...record, format_version: 1 as typeof RESULTS_FORMAT_VERSION });
    expect(() => parseCellRecord(text, 'c/cell.json')).toThrow(`c/cell.json: format_version: expected ${RESULTS_FORMAT_VERSION}, got 1 (written by another version`);
    expect(() => parseCellRecord('{"id": "x"}', 'c/cell.json')).toThrow(`c/cell.json: format_version: expected ${RESULTS_FORMAT_VERSION}, got none`);
  });

  it('rejects a record whose id is not the hash of its identity', () => {
    const text = formatCellRecord({ ...record, identity: { ...identity, seed: 4 } });
    expect(() => parseCellRecord(text, 'c/cell.json')).toThrow(`c/cell.json: id: expected ${cellId({ ...identity, seed: 4 })} (the hash of its identity), got '${record.id}'`);
  });

  it('names the key of a wrong value', () => {
    const text = formatCellRecord({ ...record, status: 'half' as 'done' });
    expect(() => parseCellRecord(text, 'c/cell.json')).toThrow(/^c\/cell\.json: status: /);
  });
});
