import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { ESLint } from 'eslint';
import tseslint from 'typescript-eslint';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import moduleTable from '../../lint/module-table.js';

// A small source tree of our own with one file per case.
const FILES: Record<string, string> = {
  'src/random.ts': 'export const seed = 1;\n',
  'src/learn/net.ts': "import * as tf from '@tensorflow/tfjs-core';\nexport const backend = tf;\n",
  'src/world/grid.ts': "import { seed } from '../random.js';\nimport * as tf from '@tensorflow/tfjs-core';\nexport const size = seed + Number(tf);\n",
  'src/results/a.ts': "import { b } from './b.js';\nexport const a = (): number => b() + 1;\n",
  'src/results/b.ts': "import { a } from './a.js';\nexport const b = (): number => a() - 1;\n",
  'src/results/typed-a.ts': "import type { T } from './typed-b.js';\nexport interface U { t: T }\n",
  'src/results/typed-b.ts': "import type { U } from './typed-a.js';\nexport interface T { u?: U }\n",
  'src/report/summary.ts': "import { size } from '../world/grid.js';\nimport type { Event } from '../experiment/events.js';\nexport const lines = (e: Event): number => size + e.n;\n",
  'src/experiment/events.ts': "import { size } from '../world/grid.js';\nexport interface Event { n: number }\nexport const start = size;\n",
  'src/experiment/runner.ts': "import { lines } from '../report/summary.js';\nexport const run = lines;\n",
  'src/extra/thing.ts': 'export const x = 1;\n',
};

let root = '';
beforeAll(() => {
  root = mkdtempSync(join(tmpdir(), 'crosswise-lint-'));
  for (const [path, text] of Object.entries(FILES)) {
    mkdirSync(dirname(join(root, path)), { recursive: true });
    writeFileSync(join(root, path), text);
  }
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

/** The messages of every file of the tree, linted with the module table rules. */
async function problems(types: boolean): Promise<Record<string, string[]>> {
  const eslint = new ESLint({
    cwd: root,
    overrideConfigFile: true,
    overrideConfig: [{
      files: ['**/*.ts'],
      languageOptions: { parser: tseslint.parser },
      plugins: { crosswise: moduleTable },
      rules: {
        'crosswise/module-order': ['error', {
          root: 'src',
          order: ['random.ts', 'world', 'learn', 'results', 'report', 'experiment'],
          apart: [['experiment', 'report']],
          packages: [{ patterns: ['@tensorflow/*'], modules: ['learn'], message: 'Only src/learn/ imports TensorFlow.js.' }],
        }],
        'crosswise/no-import-cycle': ['error', { root: 'src', types }],
      },
    }],
  });
  const results = await eslint.lintFiles(['src']);
  return Object.fromEntries(results.map((r) => [r.filePath.slice(root.length + 1), r.messages.map((m) => m.message)]));
}

describe('the module table rules', () => {
  it('fail an upward import, type-only imports included', async () => {
    expect((await problems(false))['src/report/summary.ts']).toEqual([
      'report may not import experiment: a module imports only from modules above it (random.ts, world, learn, results).',
    ]);
  });

  it('fail an import between two modules kept apart, even downward', async () => {
    expect((await problems(false))['src/experiment/runner.ts']).toEqual(['experiment and report never import each other.']);
  });

  it('fail a package imported outside the module that owns it', async () => {
    const found = await problems(false);
    expect(found['src/world/grid.ts']).toEqual(['Only src/learn/ imports TensorFlow.js.']);
    expect(found['src/learn/net.ts']).toEqual([]);
  });

  it('fail a folder that is not in the table', async () => {
    expect((await problems(false))['src/extra/thing.ts']).toEqual([
      'src/extra is not in the module table; add it to the ordered list in eslint.config.js and DEVELOPERS.md.',
    ]);
  });

  it('fail an import cycle, naming its path, and type-only cycles only when asked to', async () => {
    const values = await problems(false);
    expect(values['src/results/a.ts']).toEqual(['import cycle: src/results/a.ts → src/results/b.ts → src/results/a.ts']);
    expect(values['src/results/typed-a.ts']).toEqual([]);
    expect((await problems(true))['src/results/typed-b.ts']).toEqual(['import cycle: src/results/typed-b.ts → src/results/typed-a.ts → src/results/typed-b.ts']);
  });

  it('pass downward imports', async () => {
    const found = await problems(true);
    expect(found['src/experiment/events.ts']).toEqual([]);
    expect(found['src/random.ts']).toEqual([]);
  });
});
