import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatResultsCsv, type ResultRow } from '../../src/results/results-table.js';

// A python3 that can import pandas (Debian's python3-pandas installs for /usr/bin/python3).
const PYTHON = ['python3', '/usr/bin/python3'].find((p) => spawnSync(p, ['-c', 'import pandas']).status === 0);

// Test data: a score with masking's clean parameter (+∞), an undefined value, and a
// per-seed measure without severity or parameter.
const base = { cell: 'c1', learner: 'a', objective: 'predict', rule: 'backprop', seed: 1, target: 'x', channel: 'sound', kind: 'masking', vary: {} };
const rows: ResultRow[] = [
  { ...base, severity: 0, parameter: Infinity, measure: 'score', metric: 'r2', value: 0.5 },
  { ...base, severity: 2, parameter: 10, measure: 'score', metric: 'r2', value: NaN },
  { ...base, severity: null, parameter: null, measure: 'drop', metric: 'r2', value: 0.25 },
];

describe('results.csv in pandas', () => {
  it.skipIf(PYTHON == null)('loads with read_csv as numbers: inf as infinity, empty fields as NaN (skipped without python3 and pandas)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'crosswise-pandas-'));
    try {
      writeFileSync(join(dir, 'results.csv'), formatResultsCsv(rows, []));
      const script = `import json, sys, pandas as pd
df = pd.read_csv(sys.argv[1])
print(json.dumps({c: str(df[c].dtype) for c in ['severity', 'parameter', 'value']}))
print(json.dumps([[None if v != v else ('inf' if v == float('inf') else v) for v in df[c]] for c in ['severity', 'parameter', 'value']]))`;
      const result = spawnSync(PYTHON as string, ['-c', script, join(dir, 'results.csv')], { encoding: 'utf8' });
      expect(result.stderr).toBe('');
      const [dtypes, values] = result.stdout.trim().split('\n').map((line) => JSON.parse(line) as unknown);
      expect(dtypes).toEqual({ severity: 'float64', parameter: 'float64', value: 'float64' });
      expect(values).toEqual([[0, 2, null], ['inf', 10, null], [0.5, null, 0.25]]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
