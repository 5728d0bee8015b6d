import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateEncoder } from '../../src/probe/evaluate.js';
import { ANCHOR_CASES } from './anchor-cases.js';
import { fixtureDataset, linearEncoder } from './fixture.js';

type StoredRow = [string, string, string, number, string, number];
type StoredProbe = [string, number, number];

/**
 * Regression anchor: the scores src/probe/ gave on these workloads when the file
 * anchor-scores.json was added, before the probes were rewritten for speed (every row
 * encoded, projected and fitted one by one). A rewrite may move them only by float
 * rounding: R² by at most 1e-8 relative (nearly unpenalised ridge on features a
 * basis cut at 1e-10 of the largest eigenvalue amplifies rounding; R² under heavy noise
 * reaches −1300 here), CKA by 1e-12, chance not at all, and an accuracy by at most one
 * test row, a flip that a solver summing in another order can cause at a decision
 * boundary. The penalties chosen on validation must be the same. Measured when the
 * rewrite landed: R² within 6.4e-10 relative, CKA within 1.2e-15, accuracy and chance
 * identical.
 */
const STORED = JSON.parse(readFileSync(new URL('./anchor-scores.json', import.meta.url), 'utf8')) as Record<string, { rows: StoredRow[]; probes: StoredProbe[] }>;

describe.each(ANCHOR_CASES)('probe scores on the $name workload', (c) => {
  const { data, split } = fixtureDataset(c.steps, c.seed, c.poses);
  const { encoder } = linearEncoder(data, c.input, c.featureSize, c.encoderSeed);
  const result = evaluateEncoder({ encoder, data, split, targets: c.targets, noise: c.noise, seed: c.noiseSeed });
  const stored = STORED[c.name];

  it('choose the same penalty for every target', () => {
    expect(result.probes.map((p) => [p.target, p.alpha])).toEqual(stored.probes.map(([target, alpha]) => [target, alpha]));
  });

  it('give the stored rows in the stored order, each within its tolerance', () => {
    const tolerance = (metric: string, value: number): number =>
      ({ accuracy: 1 / split.test.length + 1e-12, chance: 0, cka: 1e-12, r2: 1e-8 * Math.max(1, Math.abs(value)) })[metric] ?? 0;
    expect(result.rows.map((r) => [r.target, r.channel, r.kind, r.severity, r.metric])).toEqual(stored.rows.map((r) => r.slice(0, 5)));
    result.rows.forEach((row, i) => {
      const expected = stored.rows[i][5];
      expect(Math.abs(row.value - expected), `${row.target} ${row.channel}/${row.kind} ${row.severity} ${row.metric}`).toBeLessThanOrEqual(tolerance(row.metric, expected));
    });
  });
});
