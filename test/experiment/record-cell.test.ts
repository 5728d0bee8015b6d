import { createHash } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Dataset, DatasetSplit } from '../../src/collect/dataset.js';
import { recordCommand } from '../../src/commands/record.js';
import { cellWork } from '../../src/experiment/cell-pipeline.js';
import { loadSweep } from '../../src/experiment/config.js';
import { planCells } from '../../src/experiment/plan.js';
import { makeRecording } from '../../src/experiment/recording.js';
import { cellData } from '../../src/experiment/cell-data.js';
import type { FeatureExtractor } from '../../src/learn/spec.js';
import { evaluateEncoder } from '../../src/probe/evaluate.js';
import { readRecording, SPLIT_NAMES } from '../../src/results/recording.js';
import { CHANNELS } from '../../src/senses/channel.js';

// The cell pipeline with the trainer replaced by a spy that keeps what the cell hands it
// and stops the cell there: the data a cell trains on, without training.
const handed: { data?: Dataset; split?: DatasetSplit } = {};
vi.mock('../../src/learn/index.js', async (importOriginal) => ({
  ...(await importOriginal<typeof import('../../src/learn/index.js')>()),
  initBackend: async () => undefined,
  trainLearner: async (_spec: unknown, data: Dataset, split: DatasetSplit) => {
    Object.assign(handed, { data, split });
    throw new Error('stopped after the trainer received its data');
  },
}));

const GREENHOUSE = resolve('worlds/greenhouse.yaml');

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'crosswise-record-cell-'));
  vi.spyOn(console, 'log').mockImplementation(() => undefined);
});
afterEach(() => vi.restoreAllMocks());

/** A tiny two-seed, two-learner sweep; cell 3 is seed 9's second learner. */
function tinyConfig(noise = ''): string {
  const path = join(dir, 'tiny.yaml');
  writeFileSync(path, [
    'name: tiny', `world: ${GREENHOUSE}`, 'seeds: [4, 9]',
    'collect: { policy: uniform, steps: 600, episode_steps: 50 }',
    'senses: { sight: { width: 3, depth: 2 }, sound: { bands: 6 } }',
    'learners:',
    '  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound] }',
    '  - { name: touch-from-motor, objective: predict, input: [motor], target: [touch] }',
    noise, '',
  ].join('\n'));
  return path;
}

const sha256 = (arrays: readonly Float32Array[]) => {
  const hash = createHash('sha256');
  for (const a of arrays) hash.update(new Uint8Array(a.buffer, a.byteOffset, a.byteLength));
  return hash.digest('hex');
};

/** Rows `steps` of a row-major [n, width] array, in order. */
const rows = (values: Float32Array, width: number, steps: ArrayLike<number>) => Array.from(steps, (t) => values.slice(t * width, (t + 1) * width));

describe('crosswise record --config --index', () => {
  it('writes the very rows the cell hands its trainer: equal sha256 of every channel\'s training rows', async () => {
    const config = tinyConfig();
    const cell = planCells(loadSweep(config))[3];
    await expect(cellWork(cell, () => undefined)).rejects.toThrow('stopped after the trainer received its data');
    const { data, split } = handed as Required<typeof handed>;
    const folder = join(dir, 'cell-3');
    expect(await recordCommand(['--config', config, '--index', '3', '--out', folder])).toBe(0);
    const recording = readRecording(folder);
    const recordedTrain = Int32Array.from(recording.split.reduce<number[]>((steps, s, t) => (s === 0 ? [...steps, t] : steps), []));
    expect(recordedTrain).toEqual(split.train);
    for (const channel of CHANNELS) {
      const width = data.channelSize[channel];
      expect(sha256(rows(recording.channels[channel], width, recordedTrain))).toBe(sha256(rows(data.channels[channel], width, split.train)));
    }
    expect(recording.manifest.source).toEqual({ kind: 'cell', config, index: 3, cell: cell.id, learner: 'touch-from-motor' });
    expect([recording.manifest.seed, recording.manifest.steps, recording.manifest.senses.sound.bands]).toEqual([9, 600, 6]);
  });
});

/** An encoder whose features are its sight input, which keeps every batch of inputs it is asked to encode. */
function identityEncoder(width: number): FeatureExtractor & { readonly seen: Float32Array[] } {
  const seen: Float32Array[] = [];
  return {
    input: ['sight'], featureSize: width, seen,
    features: (inputs, n) => {
      const sight = Float32Array.from(inputs.sight as Float32Array);
      expect(sight.length).toBe(n * width);
      seen.push(sight);
      return sight;
    },
    dispose: () => undefined,
  };
}

const rowKeys = (values: Float32Array, width: number) => new Set(rows(values, width, Array.from({ length: values.length / width }, (_, i) => i)).map((r) => r.join()));

describe('crosswise record --noise', () => {
  it('corrupts exactly the test rows the probes score, with the same draws, and leaves the other steps clean', () => {
    // An identity encoder makes the probe path's noisy inputs visible: evaluateEncoder's
    // second encoder call holds every distinct corrupted test row at severity 3.
    const cell = planCells(loadSweep(tinyConfig()))[0];
    const { data, split } = cellData(cell);
    const width = data.channelSize.sight;
    const encoder = identityEncoder(width);
    evaluateEncoder({ encoder, data, split, targets: ['x'], noise: [{ channel: 'sight', kind: 'gaussian', severities: [0, 3] }], seed: cell.seed });
    expect(encoder.seen).toHaveLength(2);
    const noisy = makeRecording({ cell, source: { kind: 'world' }, noise: [{ channel: 'sight', kind: 'gaussian', severity: 3, parameter: 1 }] });
    const recordedNoisy = new Set(rows(noisy.channels.sight, width, split.test).map((r) => r.join()));
    expect(recordedNoisy.size).toBe(split.test.length); // σ = 1 training std: no two corrupted rows coincide
    expect(recordedNoisy).toEqual(rowKeys(encoder.seen[1], width));
    const others = Array.from({ length: data.steps }, (_, t) => t).filter((t) => noisy.split[t] !== SPLIT_NAMES.indexOf('test'));
    expect(others).toHaveLength(data.steps - split.test.length);
    expect(rows(noisy.channels.sight, width, others)).toEqual(rows(data.channels.sight, width, others));
    expect(noisy.channels.sound).toEqual(data.channels.sound);
    expect(noisy.manifest.noise).toEqual([{ channel: 'sight', kind: 'gaussian', severity: 3, parameter: 1, stream: 'noise/sight/gaussian/3', rows: 'test' }]);
  });

  it("takes a severity's parameter from the cell's own noise entry, explicit parameters included", async () => {
    const config = tinyConfig('noise: [{ channel: sound, kind: masking, severities: [0, 2], parameters: [.inf, 7.5] }]');
    expect(await recordCommand(['--config', config, '--index', '0', '--noise', 'sound:masking:2,touch:dropout:4', '--out', join(dir, 'r')])).toBe(0);
    expect(readRecording(join(dir, 'r')).manifest.noise.map((n) => [n.channel, n.kind, n.severity, n.parameter])).toEqual([
      ['sound', 'masking', 2, 7.5], // the config's explicit SNR
      ['touch', 'dropout', 4, 0.7], // the severity table's p at severity 4 (src/noise/severity.ts)
    ]);
  });
});
