import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { runCommand } from '../../src/commands/run.js';
import { ConfigError } from '../../src/experiment/config-errors.js';
import { loadSweep } from '../../src/experiment/config.js';
import { configFolder, FAKE_WORK } from './helpers.js';

const VALID = `name: errors
world: world.yaml
seeds: [1]
learners:
  - name: sound-from-sight
    objective: predict
    input: [sight]
    target: [sound]
  - name: sight-autoencoder
    objective: reconstruct
    input: [sight]
noise:
  - { channel: sight, kind: gaussian }
`;

/** The lines `crosswise run` prints for a config, without their `crosswise run: ` prefix, after checking it wrote nothing and exited 1. */
async function rejection(text: string): Promise<string[]> {
  const dir = configFolder(text);
  const config = join(dir, 'config.yaml');
  const out = join(dir, 'out');
  const errors: string[] = [];
  const spy = vi.spyOn(console, 'error').mockImplementation((line: string) => { errors.push(...line.split('\n')); });
  const code = await runCommand([config, '--out', out], { workModule: FAKE_WORK });
  spy.mockRestore();
  expect(code).toBe(1);
  expect(existsSync(out)).toBe(false);
  const prefix = 'crosswise run: ';
  expect(errors.filter((line) => !line.startsWith(prefix))).toEqual([]);
  return errors.map((line) => line.slice(prefix.length).replace(`${dir}/`, ''));
}

describe('config validation', () => {
  afterEach(() => vi.restoreAllMocks());

  it('accepts the valid base config', () => {
    const dir = configFolder(VALID);
    expect(loadSweep(join(dir, 'config.yaml')).combinations).toHaveLength(1);
  });

  it('names an unknown key at its position and suggests the nearest valid key', async () => {
    expect(await rejection(`${VALID}colect: { steps: 1000 }\n`)).toEqual([
      'config.yaml:14:1: colect: unknown key (did you mean \'collect\'?); expected one of name, world, seeds, backend, collect, senses, learners, probe, noise, vary, out',
    ]);
  });

  it('rejects a wrong type with what was expected and what was found', async () => {
    expect(await rejection(VALID.replace('input: [sight]\n    target', 'input: [sight]\n    train: { epochs: ten }\n    target'))).toEqual([
      "config.yaml:8:22: learners.0 (sound-from-sight).train.epochs: expected number, got 'ten'",
    ]);
  });

  it('rejects an empty list', async () => {
    expect(await rejection(VALID.replace('seeds: [1]', 'seeds: []'))).toEqual([
      'config.yaml:3:8: seeds: expected at least 1 item, got an empty list',
    ]);
  });

  it('rejects an unknown objective and suggests the nearest', async () => {
    expect(await rejection(VALID.replace('objective: predict', 'objective: predikt'))).toEqual([
      "config.yaml:6:16: learners.0 (sound-from-sight).objective: expected one of predict | reconstruct | forecast | contrast | supervised | untrained, got 'predikt' (did you mean 'predict'?)",
    ]);
  });

  it('rejects an unknown learning rule', async () => {
    expect(await rejection(VALID.replace('objective: reconstruct', 'objective: reconstruct\n    rule: feedback-alignmnt'))).toEqual([
      "config.yaml:11:11: learners.1 (sight-autoencoder).rule: expected one of backprop | feedback-alignment | direct-feedback-alignment, got 'feedback-alignmnt' (did you mean 'feedback-alignment'?)",
    ]);
  });

  it('rejects an unknown policy', async () => {
    expect(await rejection(`${VALID}collect: { policy: wonder }\n`)).toEqual([
      "config.yaml:14:20: collect.policy: expected one of wander | uniform | seek, got 'wonder' (did you mean 'wander'?)",
    ]);
  });

  it('rejects an unknown noise kind', async () => {
    expect(await rejection(VALID.replace('kind: gaussian', 'kind: gausian'))).toEqual([
      "config.yaml:13:29: noise.0.kind: expected one of gaussian | dropout | blackout | masking, got 'gausian' (did you mean 'gaussian'?)",
    ]);
  });

  it('rejects an unknown probe target', async () => {
    expect(await rejection(`${VALID}probe: { targets: [wall_ahead, wall_ahed] }\n`)).toEqual([
      "config.yaml:14:32: probe.targets.1: expected one of x | y | heading | material_under | material_ahead | wall_ahead | nearest_emitter | nearest_distance_m | nearest_azimuth_deg | emitter_in_view | moved | bumped, got 'wall_ahed' (did you mean 'wall_ahead'?)",
    ]);
  });

  it('rejects an unknown channel', async () => {
    expect(await rejection(VALID.replace('target: [sound]', 'target: [smell]'))).toEqual([
      "config.yaml:8:14: learners.0 (sound-from-sight).target.0: expected one of sight | sound | touch | motor, got 'smell'",
    ]);
  });

  it('rejects a missing world file, resolved against the config folder', async () => {
    const lines = await rejection(VALID.replace('world: world.yaml', 'world: ../worlds/nowhere.yaml'));
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^config\.yaml:2:8: world: world file not found: \/.*\/worlds\/nowhere\.yaml$/);
  });

  it('rejects a vary path that matches no setting and suggests the nearest', async () => {
    expect(await rejection(`${VALID}vary:\n  learners.*.encoder.hiden: [[8], [16]]\n`)).toEqual([
      "config.yaml:15:3: vary.learners.*.encoder.hiden: matches no setting (did you mean 'learners.*.encoder.hidden'?)",
    ]);
  });

  it('rejects a vary value that makes the config invalid', async () => {
    expect(await rejection(`${VALID}vary:\n  collect.steps: [1000, 10]\n`)).toEqual([
      'config.yaml:15:25: vary.collect.steps.1: value 10 is invalid: collect.steps: expected a value ≥ 100, got 10',
    ]);
  });

  it('rejects a predict learner whose target equals its input', async () => {
    expect(await rejection(VALID.replace('target: [sound]', 'target: [sight]'))).toEqual([
      'config.yaml:8:13: learners.0 (sound-from-sight).target: expected channels other than the input (use objective reconstruct or forecast to predict its own input)',
    ]);
  });

  it('rejects duplicate learner names', async () => {
    expect(await rejection(VALID.replace('name: sight-autoencoder', 'name: sound-from-sight'))).toEqual([
      "config.yaml:9:11: learners.1 (sound-from-sight).name: duplicate learner name 'sound-from-sight' (also learners.0)",
    ]);
  });

  it('rejects sizes out of range', async () => {
    expect(await rejection(`${VALID}collect: { steps: 50 }\nsenses: { sound: { bands: 0 } }\n`)).toEqual([
      'config.yaml:14:19: collect.steps: expected a value ≥ 100, got 50',
      'config.yaml:15:27: senses.sound.bands: expected a value ≥ 1, got 0',
    ]);
  });

  it('rejects a probe baseline that is not a learner', async () => {
    expect(await rejection(`${VALID}probe: { baseline: sight-autoencodr }\n`)).toEqual([
      "config.yaml:14:20: probe.baseline: expected the name of a learner (sound-from-sight, sight-autoencoder), got 'sight-autoencodr' (did you mean 'sight-autoencoder'?)",
    ]);
  });

  it('rejects masking noise on a channel other than sound', async () => {
    expect(await rejection(VALID.replace('kind: gaussian', 'kind: masking'))).toEqual([
      "config.yaml:13:16: noise.0.channel: masking noise applies to sound only, got 'sight'",
    ]);
  });

  // Each noise rule of src/noise/validate.ts, reached through `run`, located in the file.
  it.each([
    ['a parameter outside its range', '{ channel: sight, kind: dropout, severities: [0, 1], parameters: [0, 1.5] }',
      'config.yaml:13:74: noise.0.parameters.1: expected a fraction p in [0, 1], got 1.5'],
    ['a parameter at severity 0 other than the clean value', '{ channel: sight, kind: gaussian, severities: [0, 2], parameters: [0.5, 1] }',
      'config.yaml:13:72: noise.0.parameters.0: severity 0 is the clean input, so its parameter must be 0, got 0.5'],
    ['a second entry with the same channel and kind', '{ channel: sight, kind: gaussian }\n  - { channel: sight, kind: gaussian, severities: [3] }',
      'config.yaml:14:5: noise.1: sight gaussian is already noise.0; entries with the same channel and kind would share result rows and noise draws'],
    ['parameters of another length than the severities', '{ channel: sight, kind: gaussian, severities: [1, 2], parameters: [0.5] }',
      'config.yaml:13:71: noise.0.parameters: expected one value per severity (2), got 1'],
  ])('rejects %s before anything runs', async (_, noise, line) => {
    expect(await rejection(VALID.replace('{ channel: sight, kind: gaussian }', noise))).toEqual([line]);
  });

  it('accepts severities beyond 5 with explicit parameters, and .inf for clean masking', () => {
    const noise = '{ channel: sight, kind: gaussian, severities: [0, 6, 7], parameters: [0, 8, 16] }\n'
      + '  - { channel: sound, kind: masking, severities: [0, 1], parameters: [.inf, 30] }';
    const dir = configFolder(VALID.replace('{ channel: sight, kind: gaussian }', noise));
    const [settings] = loadSweep(join(dir, 'config.yaml')).combinations.map((c) => c.settings);
    expect(settings.noise).toEqual([
      { channel: 'sight', kind: 'gaussian', severities: [0, 6, 7], parameters: [0, 8, 16] },
      { channel: 'sound', kind: 'masking', severities: [0, 1], parameters: [Infinity, 30] },
    ]);
  });

  it('rejects supervised targets that are not latents, and on learners that are not supervised, in one pass', async () => {
    const text = `${VALID}  - { name: oracle, objective: supervised, input: [sight], supervised_targets: [wall_ahead, smell] }\n`
      .replace('objective: reconstruct', 'objective: reconstruct\n    supervised_targets: [x]');
    const lines = await rejection(text.replace('noise:\n  - { channel: sight, kind: gaussian }\n', '') + 'noise: []\n');
    expect(lines).toEqual([
      "config.yaml:11:25: learners.1 (sight-autoencoder).supervised_targets: only supervised learners have supervised_targets; objective 'reconstruct' does not use it",
      "config.yaml:13:93: learners.2 (oracle).supervised_targets.1: expected one of x | y | heading | material_under | material_ahead | wall_ahead | nearest_emitter | nearest_distance_m | nearest_azimuth_deg | emitter_in_view | moved | bumped, got 'smell'",
    ]);
  });

  it('accepts a spiking encoder and fills its documented defaults', () => {
    const dir = configFolder(VALID.replace('    target: [sound]\n', '    target: [sound]\n    encoder: { kind: spiking, steps: 8 }\n'));
    const { spec } = loadSweep(join(dir, 'config.yaml')).combinations[0].settings.learners[0];
    expect(spec.encoder).toEqual({
      kind: 'spiking', hidden: [128, 64], steps: 8, dtMs: 1, tauMs: 2, threshold: 1, reset: 'subtract', refractoryMs: 0,
      inputCoding: 'current', surrogate: 'fast-sigmoid', surrogateSlope: 5,
    });
  });

  it('rejects an unknown encoder kind, and keys of the other kind, naming the keys this kind has', async () => {
    expect(await rejection(VALID.replace('    target: [sound]\n', '    target: [sound]\n    encoder: { kind: spikng }\n'))).toEqual([
      "config.yaml:9:22: learners.0 (sound-from-sight).encoder.kind: expected one of mlp | spiking, got 'spikng' (did you mean 'spiking'?)",
    ]);
    expect(await rejection(VALID.replace('    target: [sound]\n', '    target: [sound]\n    encoder: { kind: spiking, activation: relu }\n'))).toEqual([
      'config.yaml:9:31: learners.0 (sound-from-sight).encoder.activation: unknown key; expected one of kind, hidden, steps, dt_ms, tau_ms, threshold, reset, refractory_ms, input_coding, surrogate, surrogate_slope',
    ]);
    expect(await rejection(VALID.replace('    target: [sound]\n', '    target: [sound]\n    encoder: { tau_ms: 3 }\n'))).toEqual([
      'config.yaml:9:16: learners.0 (sound-from-sight).encoder.tau_ms: unknown key; expected one of kind, hidden, activation',
    ]);
  });

  it('rejects a refractory period that is not a whole number of time steps', async () => {
    expect(await rejection(VALID.replace('    target: [sound]\n', '    target: [sound]\n    encoder: { kind: spiking, dt_ms: 0.5, refractory_ms: 1.2 }\n'))).toEqual([
      'config.yaml:9:58: learners.0 (sound-from-sight).encoder.refractory_ms: expected 0 or a whole number of time steps (dt_ms = 0.5), got 1.2',
    ]);
  });

  it('reports every problem of a config at once, one line each', async () => {
    const lines = await rejection(VALID.replace('seeds: [1]', 'seeds: []').replace('objective: predict', 'objective: predikt'));
    expect(lines).toHaveLength(2);
  });

  it('reports four independent problems in one pass, one line each: a type error, a bad baseline, masking on touch, a vary key typo', async () => {
    const text = VALID
      .replace('input: [sight]\n    target', 'input: [sight]\n    train: { epochs: ten }\n    target')
      .replace('kind: gaussian', 'kind: gaussian }\n  - { channel: touch, kind: masking')
      + 'probe: { baseline: sight-autoencodr }\nvary:\n  learners.*.encoder.hiden: [[8], [16]]\n';
    expect(await rejection(text)).toEqual([
      "config.yaml:8:22: learners.0 (sound-from-sight).train.epochs: expected number, got 'ten'",
      "config.yaml:15:16: noise.1.channel: masking noise applies to sound only, got 'touch'",
      "config.yaml:16:20: probe.baseline: expected the name of a learner (sound-from-sight, sight-autoencoder), got 'sight-autoencodr' (did you mean 'sight-autoencoder'?)",
      "config.yaml:18:3: vary.learners.*.encoder.hiden: matches no setting (did you mean 'learners.*.encoder.hidden'?)",
    ]);
  });

  it('judges a vary value against the config as written, so its problem shows beside the config\'s own', async () => {
    const text = VALID.replace('seeds: [1]', 'seeds: []') + 'vary:\n  collect.steps: [1000, 10]\n';
    expect(await rejection(text)).toEqual([
      'config.yaml:3:8: seeds: expected at least 1 item, got an empty list',
      'config.yaml:15:25: vary.collect.steps.1: value 10 is invalid: collect.steps: expected a value ≥ 100, got 10',
    ]);
  });

  it('names list items by 0-based index and name, in keys and inside messages', async () => {
    expect(await rejection(`${VALID}vary:\n  learners.*.encoder.hidden: [[8], [0]]\n`)).toEqual([
      'config.yaml:15:36: vary.learners.*.encoder.hidden.1: value [0] is invalid: learners.0 (sound-from-sight).encoder.hidden.0: expected a value ≥ 1, got 0',
    ]);
  });

  it('rejects a combination of vary values that is invalid only together, naming the combination and the setting', async () => {
    expect(await rejection(`${VALID}vary:\n  collect.steps: [1000, 200]\n  collect.episode_steps: [100, 500]\n`)).toEqual([
      'config.yaml:15:3: vary: the combination 200, 500 is invalid: collect.episode_steps: expected at most collect.steps (200), got 500',
    ]);
  });

  it('throws ConfigError from loadSweep with the same lines', () => {
    const dir = configFolder(VALID.replace('seeds: [1]', 'seeds: []'));
    expect(() => loadSweep(join(dir, 'config.yaml'))).toThrow(ConfigError);
  });

  it('shares learner settings through YAML merge keys (<<: *anchor)', () => {
    const text = VALID
      .replace('target: [sound]', 'target: [sound]\n    <<: &shared\n      encoder: { hidden: [12] }\n      rule: feedback-alignment')
      .replace('input: [sight]\nnoise', 'input: [sight]\n    <<: *shared\nnoise');
    const dir = configFolder(text);
    const learners = loadSweep(join(dir, 'config.yaml')).combinations[0].settings.learners;
    expect(learners.map(({ spec }) => [spec.encoder.hidden, spec.rule])).toEqual([
      [[12], 'feedback-alignment'],
      [[12], 'feedback-alignment'],
    ]);
  });
});
