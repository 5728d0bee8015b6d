import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkConfigFile, loadSweep } from '../../src/experiment/config.js';
import { bundlePlugin } from '../../src/experiment/plugin-bundle.js';
import { planCells } from '../../src/experiment/plan.js';
import { resolvedConfigYaml } from '../../src/experiment/resolved-yaml.js';
import { AUTOENCODER, FA_RULE, pluginFolder, WIDTH_HELPER } from './plugin-files.js';

// What `crosswise check` (checkConfigFile) says about plug-in files, located in the config.
// Expected messages are the behaviour this project specifies; there is no outside reference.

const learner = (name: string, part: string) => `  - { name: ${name}, input: [sight], objective: reconstruct, ${part} }\n`;

describe('checking plug-in files', () => {
  it('reports every unusable plug-in at its key, with line and column', () => {
    const config = `name: broken
world: world.yaml
seeds: [1]
collect: { steps: 200, policy: ./named-wander.js }
learners:
${learner('a', 'rule: ./missing.ts')}${learner('b', 'rule: ./no-default.ts')}${learner('c', 'rule: ./a-noise.js')}${learner('d', 'rule: ./no-deltas.js')}${learner('e', 'rule: ./tensorflow.ts')}${learner('f', 'rule: ./syntax.ts')}${learner('g', 'rule: ./throws.mjs')}noise:
  - { channel: sight, kind: ./bad-table.cjs }
`;
    const dir = pluginFolder(config, {
      'named-wander.js': "export default { type: 'policy', name: 'wander', description: 'x', act: () => 'stay' };\n",
      'no-default.ts': 'export const rule = 1;\n',
      'a-noise.js': "export default { type: 'noise', name: 'n', description: 'x' };\n",
      'no-deltas.js': "export default { type: 'rule', name: 'r', description: 'x' };\n",
      'tensorflow.ts': "import * as tf from '@tensorflow/tfjs-core';\nexport default { type: 'rule', name: 't', description: String(tf) };\n",
      'syntax.ts': 'export default { type: ;\n',
      'throws.mjs': "throw new Error('not ready');\n",
      'bad-table.cjs': "module.exports = { type: 'noise', name: 'b', description: 'x', clean: 0, severities: [1, 2, 3, 4, -5], parameter: 'p ≥ 0', valid: (p) => p >= 0, corrupt: (v) => v };\n",
    });
    const at = (line: number, col: number, key: string, message: string) => `${join(dir, 'config.yaml')}:${line}:${col}: ${key}: ${message}`;
    expect(checkConfigFile(join(dir, 'config.yaml'))).toEqual([
      at(4, 32, 'collect.policy', "./named-wander.js: its name 'wander' is a built-in policy's; give the plug-in another name"),
      at(6, 62, 'learners.0 (a).rule', `./missing.ts: plug-in file not found: ${join(dir, 'missing.ts')}`),
      at(7, 62, 'learners.1 (b).rule', "./no-default.ts: expected a default export: export default { type: 'rule', name: '...', ... } (crosswise new rule NAME writes a starter)"),
      at(8, 62, 'learners.2 (c).rule', "./a-noise.js: expected a learning rule (type: 'rule'), but it is a noise kind (type: 'noise')"),
      at(9, 62, 'learners.3 (d).rule', "./no-deltas.js: its default export's deltas is missing"),
      at(10, 62, 'learners.4 (e).rule', `./tensorflow.ts: ${join(dir, 'tensorflow.ts')} imports @tensorflow/tfjs-core: a plug-in uses the tf it is given (context.tf), never its own TensorFlow.js`),
      at(11, 62, 'learners.5 (f).rule', `./syntax.ts: cannot bundle the plug-in: ${join(dir, 'syntax.ts')}:1:24: Unexpected ";"`),
      at(12, 62, 'learners.6 (g).rule', './throws.mjs: loading the plug-in threw: not ready'),
      at(14, 29, 'noise.0.kind', './bad-table.cjs: its own severity parameter -5 fails its valid()'),
    ]);
  });

  it('rejects two different files that give one kind of part the same name', () => {
    const config = `name: twins\nworld: world.yaml\nlearners:\n${learner('a', 'rule: ./one.js')}${learner('b', 'rule: ./two.js')}`;
    const rule = "export default { type: 'rule', name: 'same', description: 'x', deltas: ({ weights, chain }) => chain(weights.slice(1)) };\n";
    const dir = pluginFolder(config, { 'one.js': rule, 'two.js': rule });
    expect(checkConfigFile(join(dir, 'config.yaml'))).toEqual([
      `${join(dir, 'config.yaml')}:5:62: learners.1 (b).rule: ./two.js: its name 'same' is also the name of ${join(dir, 'one.js')}; plug-ins of one kind need distinct names`,
    ]);
  });

  it('accepts a plug-in named in vary, and writes nothing while checking', () => {
    const config = `name: varied\nworld: world.yaml\nlearners:\n${learner('a', 'rule: backprop')}vary:\n  learners.a.rule: [backprop, ./fa.js]\n`;
    const dir = pluginFolder(config, { 'fa.js': FA_RULE });
    expect(checkConfigFile(join(dir, 'config.yaml'))).toEqual([]);
    expect(existsSync(join(dir, 'runs'))).toBe(false);
  });
});

describe('a plug-in in the identity of its cells', () => {
  const config = `name: ids
world: world.yaml
seeds: [1]
learners:
  - { name: file, input: [sight], objective: ./ae.ts }
  - { name: built-in, input: [sight], objective: reconstruct }
`;

  it('changes the ids of the cells that use it when a file it imports changes, and no others', () => {
    const dir = pluginFolder(config, { 'ae.ts': AUTOENCODER, 'width.ts': WIDTH_HELPER });
    const ids = () => planCells(loadSweep(join(dir, 'config.yaml'))).map((cell) => cell.id);
    const before = ids();
    expect(ids()).toEqual(before); // bundling is deterministic
    writeFileSync(join(dir, 'width.ts'), `${WIDTH_HELPER}// a comment is a change too\n`);
    const after = ids();
    expect(after[0]).not.toBe(before[0]);
    expect(after[1]).toBe(before[1]);
  });

  it('hashes the same files the same wherever they lie, and strips TypeScript into one CommonJS script', () => {
    const one = pluginFolder(config, { 'ae.ts': AUTOENCODER, 'width.ts': WIDTH_HELPER });
    const two = pluginFolder(config, { 'ae.ts': AUTOENCODER, 'width.ts': WIDTH_HELPER });
    const [a, b] = [bundlePlugin(join(one, 'ae.ts')), bundlePlugin(join(two, 'ae.ts'))];
    expect(a.sha256).toBe(b.sha256);
    expect(a.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(a.code).toContain('module.exports');
    expect(a.code).toContain('widthOf'); // the helper is inlined
    expect(a.code).not.toContain('satisfies'); // types are stripped
  });

  it('is recorded with its path and hash in cell plans and config.resolved.yaml', () => {
    const dir = pluginFolder(config, { 'ae.ts': AUTOENCODER, 'width.ts': WIDTH_HELPER });
    const sweep = loadSweep(join(dir, 'config.yaml'), { out: join(dir, 'out') });
    const [cell] = planCells(sweep);
    const { sha256 } = bundlePlugin(join(dir, 'ae.ts'));
    expect(cell.learner.objective).toBe('ae-file'); // results show the plug-in's name
    expect(cell.plugins).toEqual([{ type: 'objective', name: 'ae-file', path: join(dir, 'ae.ts'), sha256, bundle: join(dir, 'out', 'plugins', `ae-file-${sha256.slice(0, 16)}.cjs`) }]);
    const yaml = resolvedConfigYaml(sweep);
    expect(yaml).toContain(`#   objective ae-file: ../ae.ts sha256 ${sha256}\n`);
    expect(yaml).toContain('objective: ../ae.ts');
    // It is itself a config that plans the same cells from the output folder.
    mkdirSync(join(dir, 'out'));
    writeFileSync(join(dir, 'out', 'config.resolved.yaml'), yaml);
    expect(planCells(loadSweep(join(dir, 'out', 'config.resolved.yaml'))).map((c) => c.id)).toEqual(planCells(sweep).map((c) => c.id));
  });
});
