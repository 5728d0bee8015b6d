import { describe, expect, it } from 'vitest';
import type { EpochLog } from '../../src/learn/spec.js';
import { formatTrainCsv, parseTrainCsv } from '../../src/results/train-table.js';

// Test data: invented epoch logs of a two-layer learner under feedback alignment.
const log: EpochLog[] = [
  { epoch: 1, trainLoss: 0.5, validationLoss: 0.625, seconds: 1.5, alignmentDeg: [80, 0] },
  { epoch: 2, trainLoss: 0.25, validationLoss: 0.5, seconds: 1.25, alignmentDeg: [70, 0] },
];

describe('train.csv', () => {
  it('has one line per epoch with an alignment column per layer', () => {
    expect(formatTrainCsv(log)).toBe('epoch,train_loss,validation_loss,seconds,alignment_deg_1,alignment_deg_2\n1,0.5,0.625,1.5,80,0\n2,0.25,0.5,1.25,70,0\n');
  });

  it('reads back exactly the log it was written from, with and without angles', () => {
    expect(parseTrainCsv(formatTrainCsv(log), 'train.csv')).toEqual(log);
    const backprop = log.map((entry) => ({ ...entry, alignmentDeg: [] }));
    expect(formatTrainCsv(backprop).split('\n')[0]).toBe('epoch,train_loss,validation_loss,seconds');
    expect(parseTrainCsv(formatTrainCsv(backprop), 'train.csv')).toEqual(backprop);
  });

  it('reads an empty field as an undefined number and trailing empty angles as not recorded', () => {
    const text = 'epoch,train_loss,validation_loss,seconds,alignment_deg_1\n1,0.5,,1,\n';
    const [entry] = parseTrainCsv(text, 'train.csv');
    expect(entry.validationLoss).toBeNaN();
    expect(entry.alignmentDeg).toEqual([]);
  });

  it('names the file, line and column of a bad epoch or number', () => {
    expect(() => parseTrainCsv('epoch,train_loss,validation_loss,seconds\nfirst,1,1,1\n', 'c/train.csv')).toThrow("c/train.csv:2: epoch: expected 1, got 'first'");
    expect(() => parseTrainCsv('epoch,train_loss,validation_loss,seconds\n1,x,1,1\n', 'c/train.csv')).toThrow("c/train.csv:2: train_loss: expected a number, got 'x'");
    expect(() => parseTrainCsv('epoch,loss\n', 'c/train.csv')).toThrow("c/train.csv:1: column 2: expected 'train_loss', got 'loss'");
  });

  // Test data: invented logs of a spiking learner with two hidden layers under feedback alignment.
  const spiking: EpochLog[] = [
    { epoch: 1, trainLoss: 0.5, validationLoss: 0.625, seconds: 2, alignmentDeg: [80, 60, 0], firing: { rateHz: [120.5, 3], silentFraction: [0, 0.25] } },
    { epoch: 2, trainLoss: 0.25, validationLoss: 0.5, seconds: 2, alignmentDeg: [70, 50, 0], firing: { rateHz: [110, 0], silentFraction: [0, 1] } },
  ];

  it('adds a firing-rate and a silent-fraction column per hidden layer after the angles of a spiking learner', () => {
    expect(formatTrainCsv(spiking)).toBe([
      'epoch,train_loss,validation_loss,seconds,alignment_deg_1,alignment_deg_2,alignment_deg_3,firing_rate_hz_1,firing_rate_hz_2,silent_fraction_1,silent_fraction_2',
      '1,0.5,0.625,2,80,60,0,120.5,3,0,0.25',
      '2,0.25,0.5,2,70,50,0,110,0,0,1',
      '',
    ].join('\n'));
    expect(parseTrainCsv(formatTrainCsv(spiking), 'train.csv')).toEqual(spiking);
    const backprop = spiking.map((entry) => ({ ...entry, alignmentDeg: [] }));
    expect(formatTrainCsv(backprop).split('\n')[0]).toBe('epoch,train_loss,validation_loss,seconds,firing_rate_hz_1,firing_rate_hz_2,silent_fraction_1,silent_fraction_2');
    expect(parseTrainCsv(formatTrainCsv(backprop), 'train.csv')).toEqual(backprop);
  });

  it('names a firing column out of place', () => {
    expect(() => parseTrainCsv('epoch,train_loss,validation_loss,seconds,firing_rate_hz_1,silent_fraction_2\n', 'c/train.csv'))
      .toThrow("c/train.csv:1: column 6: expected 'silent_fraction_1', got 'silent_fraction_2'");
    expect(() => parseTrainCsv('epoch,train_loss,validation_loss,seconds,firing_rate_hz_1\n', 'c/train.csv'))
      .toThrow("c/train.csv:1: column 6: expected 'silent_fraction_1'");
  });
});
