import { describe, expect, it } from 'vitest';
import type { Dataset, LatentName } from '../../src/collect/dataset.js';
import { evaluateEncoder, type EvaluationRow } from '../../src/probe/evaluate.js';
import type { NoiseSpec } from '../../src/noise/spec.js';
import { fixtureDataset, linearEncoder } from './fixture.js';

const { data, split } = fixtureDataset(2000, 11);
const seed = 3;
const sightNoise: NoiseSpec = { channel: 'sight', kind: 'gaussian', severities: [0, 1, 2, 3, 4, 5] };
const soundNoise: NoiseSpec = { channel: 'sound', kind: 'masking', severities: [0, 1, 3, 5] };
const targets = ['x', 'heading', 'wall_ahead', 'nearest_distance_m'];

const value = (rows: readonly EvaluationRow[], where: Partial<EvaluationRow>): number[] =>
  rows.filter((r) => Object.entries(where).every(([k, v]) => r[k as keyof EvaluationRow] === v)).map((r) => r.value);

describe('evaluateEncoder with a sight-only linear encoder', () => {
  const { encoder, calls } = linearEncoder(data, ['sight'], 16, 1);
  const result = evaluateEncoder({ encoder, data, split, targets: ['x', 'heading'], noise: [sightNoise, soundNoise], seed });

  it('reads what sight carries when clean (the fixture encodes x and heading linearly)', () => {
    expect(value(result.rows, { target: 'x', channel: 'sight', severity: 0, metric: 'r2' })[0]).toBeGreaterThan(0.95);
    expect(value(result.rows, { target: 'heading', channel: 'sight', severity: 0, metric: 'accuracy' })[0]).toBeGreaterThan(0.95);
  });

  it('loses accuracy and R² as sight gaussian severity grows (accuracy may hold at 1 under the mildest noise)', () => {
    for (const [target, metric] of [['x', 'r2'], ['heading', 'accuracy']] as const) {
      const curve = value(result.rows, { target, channel: 'sight', metric });
      expect(curve).toHaveLength(6);
      for (let s = 1; s < curve.length; s++) expect(curve[s]).toBeLessThanOrEqual(curve[s - 1]);
      expect(curve[5]).toBeLessThan(curve[0] - 0.3);
    }
    const cka = value(result.rows, { target: '-', channel: 'sight', metric: 'cka' });
    expect(cka[0]).toBeCloseTo(1, 9);
    for (let s = 1; s < cka.length; s++) expect(cka[s]).toBeLessThan(cka[s - 1]);
  });

  it('is unchanged under sound noise, a channel it does not read', () => {
    const clean = value(result.rows, { target: 'heading', channel: 'sight', severity: 0, metric: 'accuracy' })[0];
    expect(value(result.rows, { target: 'heading', channel: 'sound', metric: 'accuracy' })).toEqual([clean, clean, clean, clean]);
    expect(value(result.rows, { target: '-', channel: 'sound', metric: 'cka' }).every((v) => Math.abs(v - 1) < 1e-9)).toBe(true);
  });

  it('calls the encoder once for the three clean splits and once for the five corrupted sight severities', () => {
    expect(calls).toHaveLength(2); // sound noise needs no call: the encoder does not read sound
    expect(calls[0].sight).toHaveLength(2000 * 11); // every fixture row is distinct: train, validation and test rows
    expect(calls[1].sight).toHaveLength(5 * split.test.length * 11); // severities 1..5
  });

  it('writes one row per target metric, a chance row per class target and a CKA row, at every condition', () => {
    expect(result.rows).toHaveLength((6 + 4) * (2 + 1 + 1));
    const chance = value(result.rows, { target: 'heading', metric: 'chance' });
    expect(chance.every((v) => v === chance[0] && v > 0.15 && v < 0.4)).toBe(true); // four headings, about 1/4 each
  });

  it('takes chance as the majority heading\'s share of the training rows (counted here by a plain loop)', () => {
    const counts = [0, 0, 0, 0];
    for (const step of split.train) counts[data.latents.heading[step]]++;
    expect(value(result.rows, { target: 'heading', metric: 'chance' })[0]).toBe(Math.max(...counts) / split.train.length);
  });

  it('adds noisy, drop and area per target and noise on the corrected scale (src/probe/robustness.ts, Cohen 1960)', () => {
    const chance = value(result.rows, { target: 'heading', metric: 'chance' })[0];
    const corrected = value(result.rows, { target: 'heading', channel: 'sight', metric: 'accuracy' }).map((a) => (a - chance) / (1 - chance));
    const noisy = corrected.slice(1).reduce((a, b) => a + b, 0) / 5;
    const measure = (name: string, channel = 'sight') => result.measures.find((m) => m.target === 'heading' && m.channel === channel && m.measure === name)?.value;
    expect(measure('noisy')).toBeCloseTo(noisy, 12);
    expect(measure('drop')).toBeCloseTo(corrected[0] - noisy, 12);
    expect(result.measures.filter((m) => m.target === 'x' && m.channel === 'sight').map((m) => m.measure)).toEqual(['noisy', 'drop', 'area']);
    // Sound noise never reaches this encoder: nothing dropped, the whole area kept.
    expect(measure('drop', 'sound')).toBe(0);
    expect(measure('area', 'sound')).toBeCloseTo(1, 12);
  });

  it('returns the clean features of the test rows, [n_test, featureSize] when n_test ≤ 2000', () => {
    expect(result.testFeatureRows).toBe(split.test.length);
    expect(Array.from(result.testFeatures)).toEqual(Array.from(testFeaturesOf(data, split.test, 16, 1)));
  });
});

describe('returned test features', () => {
  it('keep only the first 2000 clean test rows of a larger test split', () => {
    const large = fixtureDataset(14000, 12);
    const { encoder } = linearEncoder(large.data, ['sight'], 4, 1);
    const result = evaluateEncoder({ encoder, data: large.data, split: large.split, targets: ['x'], noise: [], seed });
    expect(large.split.test.length).toBeGreaterThan(2000);
    expect(result.testFeatureRows).toBe(2000);
    expect(Array.from(result.testFeatures)).toEqual(Array.from(testFeaturesOf(large.data, large.split.test.subarray(0, 2000), 4, 1)));
  });
});

describe('common random numbers', () => {
  it('gives two different learners of one seed identical corrupted inputs', () => {
    const first = linearEncoder(data, ['sight'], 8, 1);
    const second = linearEncoder(data, ['sight', 'touch'], 12, 2);
    evaluateEncoder({ encoder: first.encoder, data, split, targets: ['x'], noise: [sightNoise], seed });
    evaluateEncoder({ encoder: second.encoder, data, split, targets: ['x'], noise: [sightNoise], seed });
    expect(Array.from(second.calls[1].sight as Float32Array)).toEqual(Array.from(first.calls[1].sight as Float32Array));
    const cleanTest = first.calls[0].sight?.subarray((split.train.length + split.validation.length) * 11);
    expect(Array.from(first.calls[1].sight?.subarray(0, split.test.length * 11) ?? [])).not.toEqual(Array.from(cleanTest ?? []));
  });
});

describe('penalty selection', () => {
  it('never looks at the test split: scrambling test labels and test inputs leaves every chosen α unchanged', () => {
    const scrambled = withScrambledRows(data, split.test);
    const evaluate = (d: Dataset) => evaluateEncoder({ encoder: linearEncoder(d, ['sight', 'sound'], 16, 5).encoder, data: d, split, targets, noise: [], seed }).probes;
    const original = evaluate(data);
    const changed = evaluate(scrambled);
    expect(changed).toEqual(original);
    // The same scrambling applied to the validation rows does move the choice, so the check has power.
    expect(evaluate(withScrambledRows(data, split.validation))).not.toEqual(original);
  });
});

describe('repeated views', () => {
  it('go through the encoder once per split: the first call holds each split\'s distinct sight rows', () => {
    const revisited = fixtureDataset(2000, 13, 40); // every step one of 40 poses, as an agent in a grid world revisits places
    const { encoder, calls } = linearEncoder(revisited.data, ['sight'], 8, 2);
    evaluateEncoder({ encoder, data: revisited.data, split: revisited.split, targets: ['x'], noise: [], seed });
    const sight = revisited.data.channels.sight;
    const views = (rows: Int32Array) => new Set(Array.from(rows, (t) => sight.subarray(t * 11, t * 11 + 11).join(','))).size;
    const { train, validation, test } = revisited.split;
    expect(calls).toHaveLength(1);
    expect(calls[0].sight).toHaveLength((views(train) + views(validation) + views(test)) * 11);
    expect(views(train)).toBeLessThanOrEqual(40);
  });
});

describe('undefined latents', () => {
  it('are refused with the target and the step, since the collector defines every latent at every step', () => {
    const distance = Float32Array.from(data.latents.nearest_distance_m);
    distance[split.validation[3]] = NaN;
    const { encoder } = linearEncoder(data, ['sound'], 16, 6);
    expect(() => evaluateEncoder({ encoder, data: { ...data, latents: { ...data.latents, nearest_distance_m: distance } }, split, targets: ['nearest_distance_m'], noise: [], seed }))
      .toThrow(`probe target 'nearest_distance_m' has no value at step ${split.validation[3]} (NaN); every latent must be defined at every step`);
  });
});

describe('input checks', () => {
  const { encoder } = linearEncoder(data, ['sight'], 4, 1);
  it('names an unknown target and the valid ones', () => {
    expect(() => evaluateEncoder({ encoder, data, split, targets: ['colour'], noise: [], seed })).toThrow("probe target 'colour' is unknown; expected one of x, y, heading");
  });

  it('rejects an invalid noise spec before any work', () => {
    expect(() => evaluateEncoder({ encoder, data, split, targets: ['x'], noise: [{ channel: 'sight', kind: 'masking', severities: [1] }], seed }))
      .toThrow("noise.0.channel: masking noise applies to sound only, got 'sight'");
  });
});

/** What a fresh copy of the fake sight encoder gives for the given rows. */
function testFeaturesOf(source: Dataset, rows: Int32Array, featureSize: number, encoderSeed: number): Float32Array {
  const sight = new Float32Array(rows.length * 11);
  rows.forEach((row, i) => sight.set(source.channels.sight.subarray(row * 11, row * 11 + 11), i * 11));
  return linearEncoder(source, ['sight'], featureSize, encoderSeed).encoder.features({ sight }, rows.length);
}

/** The dataset with each given row's latents and channel values taken from another given row (x set far off, inputs negated). */
function withScrambledRows(source: Dataset, rows: Int32Array): Dataset {
  const donor = (i: number) => rows[(i * 7 + 3) % rows.length];
  const latents = Object.fromEntries(Object.entries(source.latents).map(([name, values]) => {
    const out = Float32Array.from(values);
    rows.forEach((row, i) => { out[row] = name === 'x' ? 100 + i : values[donor(i)]; });
    return [name, out];
  })) as Record<LatentName, Float32Array>;
  const channels = Object.fromEntries(Object.entries(source.channels).map(([name, values]) => {
    const size = source.channelSize[name as keyof typeof source.channelSize];
    const out = Float32Array.from(values);
    rows.forEach((row, i) => out.set(values.subarray(donor(i) * size, donor(i) * size + size).map((v) => -v), row * size));
    return [name, out];
  })) as Dataset['channels'];
  return { ...source, latents, channels };
}
