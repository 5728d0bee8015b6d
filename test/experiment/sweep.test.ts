import { join } from 'node:path';
import { writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadSweep } from '../../src/experiment/config.js';
import { planCells } from '../../src/experiment/plan.js';
import { cartesian, matchVaryPath } from '../../src/experiment/vary.js';
import { configFolder } from './helpers.js';

const CONFIG = `name: sweep
world: world.yaml
seeds: [1, 2, 3]
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound] }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight] }
vary:
  learners.*.encoder.hidden: [[64], [128, 64]]
  collect.steps: [1000, 2000]
`;

function plan(text: string) {
  const dir = configFolder(text);
  return { dir, sweep: loadSweep(join(dir, 'config.yaml')), cells: () => planCells(loadSweep(join(dir, 'config.yaml'))) };
}

describe('sweep expansion', () => {
  it('makes one cell per combination of vary values, seed and learner', () => {
    // 2 hidden sizes × 2 step counts × 3 seeds × 2 learners.
    expect(plan(CONFIG).cells()).toHaveLength(24);
  });

  it('numbers cells in order: first vary key slowest, then seed, then learner', () => {
    const cells = plan(CONFIG).cells();
    expect(cells.map((cell) => cell.index)).toEqual([...Array(24).keys()]);
    expect(cells.slice(0, 3).map((cell) => [cell.learner.name, cell.seed, cell.vary['collect.steps']])).toEqual([
      ['sound-from-sight', 1, '1000'],
      ['sight-autoencoder', 1, '1000'],
      ['sound-from-sight', 2, '1000'],
    ]);
    expect(cells[6].vary).toEqual({ 'learners.*.encoder.hidden': '[64]', 'collect.steps': '2000' });
    expect(cells[12].vary).toEqual({ 'learners.*.encoder.hidden': '[128,64]', 'collect.steps': '1000' });
  });

  it('applies a * path to every learner', () => {
    const cells = plan(CONFIG).cells();
    expect(cells.filter((cell) => cell.vary['learners.*.encoder.hidden'] === '[128,64]').every((cell) => cell.learner.encoder.hidden.join() === '128,64')).toBe(true);
    expect(cells.filter((cell) => cell.vary['learners.*.encoder.hidden'] === '[64]').every((cell) => cell.learner.encoder.hidden.join() === '64')).toBe(true);
  });

  it('selects one learner by name in a vary path', () => {
    const cells = plan(`${CONFIG.split('vary:')[0]}vary:\n  learners.sound-from-sight.rule: [backprop, feedback-alignment]\n`).cells();
    expect(cells.map((cell) => `${cell.learner.name}:${cell.learner.rule}`).slice(0, 2)).toEqual(['sound-from-sight:backprop', 'sight-autoencoder:backprop']);
    expect(cells.filter((cell) => cell.learner.name === 'sight-autoencoder').every((cell) => cell.learner.rule === 'backprop')).toBe(true);
    expect(cells.filter((cell) => cell.vary['learners.sound-from-sight.rule'] === 'feedback-alignment' && cell.learner.name === 'sound-from-sight')
      .every((cell) => cell.learner.rule === 'feedback-alignment')).toBe(true);
  });

  it('gives every cell a distinct 10-hex-digit id', () => {
    const ids = plan(CONFIG).cells().map((cell) => cell.id);
    expect(ids.every((id) => /^[0-9a-f]{10}$/.test(id))).toBe(true);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('keeps ids stable across loads and when unrelated text or the baseline changes', () => {
    const first = plan(CONFIG).cells().map((cell) => cell.id);
    const again = plan(`# a comment\n${CONFIG}probe: { baseline: sight-autoencoder }\n`).cells().map((cell) => cell.id);
    expect(again).toEqual(first);
  });

  it('changes the id when a setting that affects the numbers changes', () => {
    const first = plan(CONFIG).cells().map((cell) => cell.id);
    expect(plan(CONFIG.replace('seeds: [1, 2, 3]', 'seeds: [1, 2, 3]\ncollect: { episode_steps: 100 }')).cells().map((cell) => cell.id).some((id) => first.includes(id))).toBe(false);
    const { dir, cells } = plan(CONFIG);
    const before = cells().map((cell) => cell.id);
    writeFileSync(join(dir, 'world.yaml'), '# the world file changed\n', { flag: 'a' });
    expect(cells().map((cell) => cell.id).some((id) => before.includes(id))).toBe(false);
  });

  it('keeps ids when only output-only settings change: save_features and align_every', () => {
    const first = plan(CONFIG).cells().map((cell) => cell.id);
    const output = CONFIG.replace('target: [sound] }', 'target: [sound], save_features: true, train: { align_every: 7 } }');
    const cells = plan(output).cells();
    expect(cells.map((cell) => cell.id)).toEqual(first);
    expect(cells[0].output).toEqual({ saveFeatures: true, alignEvery: 7 });
  });

  it('gives two identically configured learners under different names different ids', () => {
    const twins = CONFIG.replace('{ name: sight-autoencoder, objective: reconstruct, input: [sight] }',
      '{ name: sound-from-sight-twin, objective: predict, input: [sight], target: [sound] }');
    const cells = plan(twins).cells();
    expect(cells[0].learner).toEqual({ ...cells[1].learner, name: 'sound-from-sight' });
    expect(cells[0].id).not.toBe(cells[1].id);
  });

  it('fills every default into the resolved settings in module spelling', () => {
    const settings = plan(CONFIG).sweep.combinations[0].settings;
    expect(settings.collect).toEqual({ policy: 'wander', steps: 1000, episodeSteps: 200, split: { train: 0.7, validation: 0.15, test: 0.15 } });
    expect(settings.senses).toEqual({ sight: { width: 5, depth: 4 }, sound: { bands: 16, minHz: 100, maxHz: 8000 } });
    expect(settings.learners[1]).toEqual({
      spec: {
        name: 'sight-autoencoder', objective: 'reconstruct', input: ['sight'], target: [], offset: 0, supervisedTargets: [],
        encoder: { kind: 'mlp', hidden: [64], activation: 'relu' }, rule: 'backprop',
        train: { optimizer: 'adam', learningRate: 0.001, batch: 256, epochs: 10, patience: 3, temperature: 0.1 },
      },
      output: { saveFeatures: false, alignEvery: 50 },
      control: false,
    });
    expect(settings.probe.baseline).toBe('sound-from-sight');
    expect(settings.probe.primary).toBe('noisy');
  });

  it('makes untrained and supervised learners controls unless the config says otherwise', () => {
    const config = CONFIG.replace('{ name: sight-autoencoder, objective: reconstruct, input: [sight] }',
      '{ name: sight-autoencoder, objective: reconstruct, input: [sight] }\n  - { name: floor, objective: untrained, input: [sight] }\n'
      + '  - { name: ceiling, objective: supervised, input: [sight], control: false }\n  - { name: odd, objective: reconstruct, input: [sight], control: true }');
    const { learners } = plan(config).sweep.combinations[0].settings;
    expect(learners.map((l) => `${l.spec.name} ${l.control}`)).toEqual(['sound-from-sight false', 'sight-autoencoder false', 'floor true', 'ceiling false', 'odd true']);
  });
});

describe('vary paths', () => {
  const config = { collect: { steps: 5 }, learners: [{ name: 'a', encoder: { hidden: [1] } }, { name: 'b', target: ['x'], encoder: { hidden: [2] } }] };

  it('expands * over list items that have the rest of the path', () => {
    expect(matchVaryPath(config, 'learners.*.encoder.hidden')).toEqual([['learners', 0, 'encoder', 'hidden'], ['learners', 1, 'encoder', 'hidden']]);
    expect(matchVaryPath(config, 'learners.*.target')).toEqual([['learners', 1, 'target']]);
  });

  it('matches nothing for unknown keys or sections that cannot vary', () => {
    expect(matchVaryPath(config, 'collect.stepz')).toEqual([]);
    expect(matchVaryPath({ seeds: [1] }, 'seeds')).toEqual([]);
  });

  it('forms the cartesian product with the first list varying slowest', () => {
    expect(cartesian([[1, 2], ['a', 'b']])).toEqual([[1, 'a'], [1, 'b'], [2, 'a'], [2, 'b']]);
    expect(cartesian([])).toEqual([[]]);
  });
});
