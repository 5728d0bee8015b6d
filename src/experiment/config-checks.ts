import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { spikingProblems } from '../learn/spiking-checks.js';
import { noiseProblems } from '../noise/validate.js';
import { suggestion, type ConfigProblem } from './config-errors.js';
import { encoderSpec } from './resolved-config.js';
import type { FilledConfig } from './schema.js';

type Learner = FilledConfig['learners'][number];

/** Problems a schema cannot see: cross-references, files on disk, sums and learner consistency. */
export function checkConfig(config: FilledConfig, configDir: string): ConfigProblem[] {
  return [
    ...checkWorld(config, configDir),
    ...checkSeeds(config.seeds),
    ...checkCollect(config),
    ...checkSenses(config),
    ...checkLearnerNames(config.learners),
    ...config.learners.flatMap((learner, i) => checkLearner(learner, ['learners', i])),
    ...checkProbe(config),
    ...noiseProblems(config.noise),
  ];
}

function checkWorld(config: FilledConfig, configDir: string): ConfigProblem[] {
  const path = resolve(configDir, config.world);
  if (existsSync(path) && statSync(path).isFile()) return [];
  return [{ path: ['world'], message: `world file not found: ${path}` }];
}

function checkSeeds(seeds: readonly number[]): ConfigProblem[] {
  return seeds.flatMap((seed, i) =>
    seeds.indexOf(seed) < i ? [{ path: ['seeds', i], message: `seed ${seed} is listed twice` }] : []);
}

function checkCollect({ collect }: FilledConfig): ConfigProblem[] {
  const problems: ConfigProblem[] = [];
  const sum = collect.split.train + collect.split.validation + collect.split.test;
  if (Math.abs(sum - 1) > 1e-9) {
    problems.push({ path: ['collect', 'split'], message: `expected train + validation + test = 1, got ${Number(sum.toFixed(6))}` });
  }
  if (collect.episode_steps > collect.steps) {
    problems.push({ path: ['collect', 'episode_steps'], message: `expected at most collect.steps (${collect.steps}), got ${collect.episode_steps}` });
  }
  return problems;
}

function checkSenses({ senses }: FilledConfig): ConfigProblem[] {
  if (senses.sound.min_hz < senses.sound.max_hz) return [];
  return [{ path: ['senses', 'sound', 'max_hz'], message: `expected more than min_hz (${senses.sound.min_hz}), got ${senses.sound.max_hz}` }];
}

function checkLearnerNames(learners: readonly Learner[]): ConfigProblem[] {
  const names = learners.map((learner) => learner.name);
  return names.flatMap((name, i) => {
    const first = names.indexOf(name);
    return first < i ? [{ path: ['learners', i, 'name'], message: `duplicate learner name '${name}' (also learners.${first})` }] : [];
  });
}

function checkLearner(learner: Learner, at: readonly (string | number)[]): ConfigProblem[] {
  const problems: ConfigProblem[] = [];
  const problem = (key: string, message: string) => problems.push({ path: [...at, key], message });
  learner.input.forEach((channel, i) => {
    if (learner.input.indexOf(channel) < i) problems.push({ path: [...at, 'input', i], message: `channel '${channel}' is listed twice` });
  });
  const wantsTarget = learner.objective === 'predict' || learner.objective === 'contrast';
  if (wantsTarget && (learner.target == null || learner.target.length === 0)) {
    problem('target', `required for objective '${learner.objective}': a non-empty list of channels`);
  }
  if (!wantsTarget && learner.target != null) {
    problem('target', `only predict and contrast learners have a target; objective '${learner.objective}' does not use it`);
  }
  if (learner.objective === 'predict' && learner.target != null && sameSet(learner.target, learner.input)) {
    problem('target', 'expected channels other than the input (use objective reconstruct or forecast to predict its own input)');
  }
  if (learner.objective !== 'supervised' && learner.supervised_targets != null) {
    problem('supervised_targets', `only supervised learners have supervised_targets; objective '${learner.objective}' does not use it`);
  }
  if (learner.objective === 'supervised' && learner.supervised_targets?.length === 0) {
    problem('supervised_targets', 'expected at least 1 item, got an empty list');
  }
  const encoder = encoderSpec(learner.encoder);
  if (encoder.kind === 'spiking') {
    problems.push(...spikingProblems(encoder, learner.rule).map(({ key, message }) => ({ path: [...at, ...key], message })));
  }
  return problems;
}

function sameSet(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((item) => b.includes(item));
}

function checkProbe({ probe, learners }: FilledConfig): ConfigProblem[] {
  if (probe.baseline == null) return [];
  const names = learners.map((learner) => learner.name);
  if (names.includes(probe.baseline)) return [];
  return [{
    path: ['probe', 'baseline'],
    message: `expected the name of a learner (${names.join(', ')}), got '${probe.baseline}'${suggestion(probe.baseline, names)}`,
  }];
}
