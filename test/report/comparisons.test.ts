import { describe, expect, it } from 'vitest';
import { compareWithBaseline, primaryFamilySizes, type Comparison, type FamilyRules } from '../../src/report/comparisons.js';
import { combinations } from '../../src/report/groups.js';
import type { MeasureRow, ScoreRow } from '../../src/results/results-table.js';
import { holm } from '../../src/stats/holm.js';

// σ of the gaussian row of the severity table (src/noise/severity.ts), by severity.
const GAUSSIAN_SIGMA = [0, 0.25, 0.5, 1, 2, 4];

// Student t with 2 df has the closed form P(|T| > t) = 1 − |t| / √(t² + 2) (Student 1908).
const p2 = (t: number): number => 1 - Math.abs(t) / Math.sqrt(t * t + 2);

// Test data: learners a (baseline), b and c, three seeds, one target, two noises that share
// the clean (severity 0) score and differ at severity 1. Measures are written by hand.
function score(learner: string, seed: number, channel: string, severity: number, value: number): ScoreRow {
  return { cell: `${learner}${seed}`, learner, objective: 'predict', rule: 'backprop', seed, target: 'x', channel,
    kind: 'gaussian', severity, parameter: GAUSSIAN_SIGMA[severity], measure: 'score', metric: 'r2', value, vary: {} };
}
function measure(learner: string, seed: number, channel: string, name: MeasureRow['measure'], value: number): MeasureRow {
  return { ...score(learner, seed, channel, 0, value), severity: null, parameter: null, measure: name };
}

const rules = (controls: string[] = []): FamilyRules => ({ baseline: 'a', primary: 'noisy', controls: new Set(controls) });
const compare = (scores: ScoreRow[], measures: MeasureRow[], controls: string[] = []): Comparison[] =>
  compareWithBaseline(combinations(scores, [], measures), rules(controls));

/** Score rows of learners a and b: clean 0.5 + 0.1·seed (b a little higher), then the given value at severity 1 per noise. */
function twoNoises(atOne: (learner: string, seed: number, channel: string) => number): ScoreRow[] {
  const rows: ScoreRow[] = [];
  for (const seed of [1, 2, 3]) {
    for (const channel of ['sight', 'sound']) {
      rows.push(score('a', seed, channel, 0, 0.5 + 0.1 * seed), score('b', seed, channel, 0, 0.55 + 0.1 * seed + 0.01 * seed));
      rows.push(score('a', seed, channel, 1, atOne('a', seed, channel)), score('b', seed, channel, 1, atOne('b', seed, channel)));
    }
  }
  return rows;
}
const moving = twoNoises((learner, seed, channel) => (learner === 'a' ? 0.3 : channel === 'sight' ? 0.3 + 0.1 * seed : 0.3 + 0.05 * seed * seed));

describe('compareWithBaseline', () => {
  it('pairs by seed and computes b − a per severity', () => {
    const sight1 = compare(moving, []).find((c) => c.channel === 'sight' && c.severity === 1)!;
    // Differences 0.1, 0.2, 0.3 → mean 0.2, sd 0.1, t = 0.2 / (0.1 / √3) = 3.4641 (by hand).
    expect(sight1.meanDiff).toBeCloseTo(0.2, 12);
    expect(sight1.t).toBeCloseTo(2 * Math.sqrt(3), 10);
    expect(sight1.p).toBeCloseTo(p2(2 * Math.sqrt(3)), 10);
  });

  it('lists the clean comparison shared by two noises once, under the first noise', () => {
    const all = compare(moving, []);
    expect(all.map((c) => `${c.channel} ${c.severity}`)).toEqual(['sight 0', 'sight 1', 'sound 1']);
  });

  it('adjusts the exploratory scores within each target and noise (Holm 1979)', () => {
    const all = compare(moving, []);
    const sight = all.filter((c) => c.channel === 'sight');
    expect(sight.every((c) => c.family === 'exploratory')).toBe(true);
    expect(sight.map((c) => c.pHolm)).toEqual(holm(sight.map((c) => c.p)));
    const sound = all.find((c) => c.channel === 'sound')!;
    expect(sound.pHolm).toBe(sound.p); // alone in its family: m = 1
  });

  it('leaves out learners without a seed in common with the baseline', () => {
    const only = [score('a', 1, 'sight', 0, 0.5), score('b', 2, 'sight', 0, 0.6)];
    expect(compare(only, [])).toEqual([]);
  });
});

describe('hypothesis families', () => {
  // noisy per seed under sight: a 0.30, 0.40, 0.50; b adds 0.1, 0.2, 0.4; c (a control) adds
  // 0.2, 0.3, 0.4; under sound every noisy value is 0.05 lower. drop: a 0.2 in every seed,
  // b 0.1, 0.1, 0.2, c 0.25, 0.2, 0.1 under sight, 0.01 more under sound.
  const measures: MeasureRow[] = [];
  for (const [i, seed] of [1, 2, 3].entries()) {
    for (const [channel, shift] of [['sight', 0], ['sound', 0.05]] as const) {
      measures.push(measure('a', seed, channel, 'noisy', [0.3, 0.4, 0.5][i] - shift), measure('a', seed, channel, 'drop', 0.2 + shift / 5));
      measures.push(measure('b', seed, channel, 'noisy', [0.4, 0.6, 0.9][i] - shift), measure('b', seed, channel, 'drop', [0.1, 0.1, 0.2][i] + shift / 5));
      measures.push(measure('c', seed, channel, 'noisy', [0.5, 0.7, 0.9][i] - shift), measure('c', seed, channel, 'drop', [0.25, 0.2, 0.1][i] + shift / 5));
    }
  }
  const scores = twoNoises((learner, seed, channel) => (channel === 'sight' ? 0.3 : 0.2 + 0.01 * seed + (learner === 'b' ? 0.1 * seed : 0)))
    .concat([1, 2, 3].flatMap((seed) => ['sight', 'sound'].flatMap((channel) => [0, 1].map((s) => score('c', seed, channel, s, 0.4 + 0.1 * s * seed)))));
  const all = compare(scores, measures, ['c']);

  it('puts the primary measure of each learner that is neither the baseline nor a control, per target and noise, in the primary family', () => {
    const primary = all.filter((c) => c.family === 'primary');
    expect(primary.map((c) => `${c.learner} ${c.measure} ${c.channel}`)).toEqual(['b noisy sight', 'b noisy sound']);
    expect(primaryFamilySizes(all).get(1)).toBe(2);
  });

  it('runs Holm over the primary family alone: b − a noisy 0.1, 0.2, 0.4 has t = 2.6458, p doubled over m = 2', () => {
    // Differences 0.1, 0.2, 0.4: mean 0.2333, sd 0.15275, t = 0.2333 / (0.15275 / √3) = 2.6458 (by hand).
    const [sight, sound] = all.filter((c) => c.family === 'primary');
    expect(sight.t).toBeCloseTo(2.6458, 4);
    expect(sight.pHolm).toBeCloseTo(2 * p2(2.6458), 4);
    expect(sound.pHolm).toBeCloseTo(sight.pHolm, 10);
  });

  it('keeps a control and the other measures exploratory', () => {
    expect(all.filter((c) => c.learner === 'c').every((c) => c.family === 'exploratory')).toBe(true);
    expect(all.find((c) => c.learner === 'b' && c.measure === 'drop')!.family).toBe('exploratory');
  });

  it('adjusts an exploratory p within its target and noise only', () => {
    const sound = all.filter((c) => c.family === 'exploratory' && c.channel === 'sound');
    expect(sound.map((c) => c.pHolm)).toEqual(holm(sound.map((c) => c.p)));
  });
});

describe('identical comparisons', () => {
  it('give two learners with the same values in every seed the family identical and no p, once each', () => {
    const twin = moving.filter((r) => r.learner === 'a').map((r) => ({ ...r, learner: 'twin' }));
    const measures = [1, 2, 3].flatMap((seed) => ['a', 'twin'].map((l) => measure(l, seed, 'sight', 'noisy', 0.1 * seed)));
    const all = compare([...moving.filter((r) => r.learner === 'a'), ...twin], measures);
    expect(all.map((c) => `${c.channel} ${c.measure} ${c.severity} ${c.family}`)).toEqual([
      'sight score 0 identical', 'sight score 1 identical', 'sight noisy null identical', // sound's severity 1 repeats sight's: listed once
    ]);
    for (const c of all) {
      expect([c.meanDiff, c.ciLow, c.ciHigh]).toEqual([0, 0, 0]);
      expect([c.p, c.pHolm, c.dz]).toEqual([NaN, NaN, NaN]);
    }
  });

  it('mark every measure under a noise that moved neither learner\'s score identical, and test the same measure under a noise that did', () => {
    // Sound noise leaves both learners at their clean score; sight noise moves both.
    const scores = twoNoises((learner, seed, channel) => (channel === 'sound'
      ? (learner === 'a' ? 0.5 + 0.1 * seed : 0.55 + 0.11 * seed) : 0.2 + 0.01 * seed * seed + (learner === 'b' ? 0.05 * seed : 0)));
    const measures = [1, 2, 3].flatMap((seed) => ['sight', 'sound'].flatMap((channel) => [
      measure('a', seed, channel, 'noisy', channel === 'sound' ? 0.5 + 0.1 * seed : 0.2 + 0.01 * seed * seed),
      measure('b', seed, channel, 'noisy', channel === 'sound' ? 0.55 + 0.11 * seed : 0.2 + 0.01 * seed * seed + 0.05 * seed),
    ]));
    const all = compare(scores, measures);
    expect(all.map((c) => `${c.channel} ${c.measure} ${c.severity} ${c.family}`)).toEqual([
      'sight score 0 exploratory', 'sight score 1 exploratory', 'sight noisy null primary', 'sound noisy null identical',
    ]);
    expect(all.at(-1)!.p).toBeNaN();
  });
});
