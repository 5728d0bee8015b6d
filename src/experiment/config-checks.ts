import { spikingProblems } from '../learn/spiking-checks.js';
import { noiseProblems } from '../noise/validate.js';
import { suggestion, type ConfigProblem } from './config-errors.js';
import type { ConfigParts } from './config-parts.js';
import { encoderSpec } from './resolved-config.js';
import type { FilledConfig } from './schema.js';

type Learner = FilledConfig['learners'][number];

/**
 * Problems a schema cannot see: cross-references, sums and learner consistency (world
 * files: world-checks.ts). Each check runs on the parts it needs whenever they are valid.
 */
export function checkConfig(parts: ConfigParts): ConfigProblem[] {
  return [
    ...(parts.seeds == null ? [] : checkSeeds(parts.seeds)),
    ...(parts.collect == null ? [] : checkCollect(parts.collect)),
    ...(parts.senses == null ? [] : checkSenses(parts.senses)),
    ...checkLearnerNames(parts.learnerNames),
    ...parts.learners.flatMap((learner, i) => (learner == null ? [] : checkLearner(learner, ['learners', i]))),
    ...(parts.probe == null ? [] : checkProbe(parts.probe, parts.learnerNames)),
    ...noiseProblems(parts.noise),
  ];
}

function checkSeeds(seeds: readonly number[]): ConfigProblem[] {
  return seeds.flatMap((seed, i) =>
    seeds.indexOf(seed) < i ? [{ path: ['seeds', i], message: `seed ${seed} is listed twice` }] : []);
}

function checkCollect(collect: FilledConfig['collect']): ConfigProblem[] {
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

function checkSenses(senses: FilledConfig['senses']): ConfigProblem[] {
  if (senses.sound.min_hz < senses.sound.max_hz) return [];
  return [{ path: ['senses', 'sound', 'max_hz'], message: `expected more than min_hz (${senses.sound.min_hz}), got ${senses.sound.max_hz}` }];
}

function checkLearnerNames(names: readonly (string | undefined)[]): ConfigProblem[] {
  return names.flatMap((name, i) => {
    const first = names.indexOf(name);
    return name != null && first < i ? [{ path: ['learners', i, 'name'], message: `duplicate learner name '${name}' (also learners.${first})` }] : [];
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

function checkProbe(probe: FilledConfig['probe'], learnerNames: readonly (string | undefined)[]): ConfigProblem[] {
  // A learner whose name is not text may be the one meant; its own problem comes first.
  if (probe.baseline == null || learnerNames.includes(probe.baseline) || learnerNames.includes(undefined)) return [];
  const names = learnerNames as readonly string[];
  return [{
    path: ['probe', 'baseline'],
    message: `expected the name of a learner (${names.join(', ')}), got '${probe.baseline}'${suggestion(probe.baseline, names)}`,
  }];
}
