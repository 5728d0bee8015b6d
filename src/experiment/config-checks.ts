import { OBJECTIVE_TARGET, type ObjectiveName, type TargetUse } from '../learn/spec.js';
import { spikingProblems } from '../learn/spiking-checks.js';
import type { NoiseKindDefinition } from '../noise/kind-definition.js';
import { builtInNoiseKind, noiseProblems } from '../noise/validate.js';
import { suggestion, type ConfigProblem } from './config-errors.js';
import type { ConfigParts } from './config-parts.js';
import { isPluginPath } from './plugin-bundle.js';
import type { PluginCatalog } from './plugin-catalog.js';
import type { PluginType } from './plugin-shapes.js';
import { encoderSpec } from './resolved-config.js';
import type { FilledConfig } from './schema.js';

type Learner = FilledConfig['learners'][number];
type Path = readonly (string | number)[];

/**
 * Problems a schema cannot see: cross-references, plug-in files, sums and learner
 * consistency (world files: world-checks.ts). Each check runs on the parts it needs whenever
 * they are valid. A plug-in file is loaded (once per catalog) and its problem reported at the
 * key that names it.
 */
export function checkConfig(parts: ConfigParts, plugins: PluginCatalog): ConfigProblem[] {
  const problems: ConfigProblem[] = [];
  /** The plug-in a value names (null when it cannot be used: its problem is recorded at `path`), or undefined for a built-in name. */
  const plugin = (type: PluginType, value: string, path: Path): unknown => {
    if (!isPluginPath(value)) return undefined;
    const loaded = plugins.resolve(type, value);
    if ('problem' in loaded) problems.push({ path, message: loaded.problem });
    return 'problem' in loaded ? null : loaded.definition;
  };
  if (parts.collect != null) plugin('policy', parts.collect.policy, ['collect', 'policy']);
  const noiseKinds = new Map(parts.noise.flatMap((entry, i) => (entry == null ? [] : [[entry.kind, plugin('noise', entry.kind, ['noise', i, 'kind']) as NoiseKindDefinition | null | undefined] as const])));
  problems.push(
    ...(parts.seeds == null ? [] : checkSeeds(parts.seeds)),
    ...(parts.collect == null ? [] : checkCollect(parts.collect)),
    ...(parts.senses == null ? [] : checkSenses(parts.senses)),
    ...checkLearnerNames(parts.learnerNames),
    ...parts.learners.flatMap((learner, i) => {
      if (learner == null) return [];
      const at = ['learners', i];
      const objective = plugin('objective', learner.objective, [...at, 'objective']) as { readonly target: TargetUse } | null | undefined;
      plugin('rule', learner.rule, [...at, 'rule']);
      return checkLearner(learner, at, objective === undefined ? OBJECTIVE_TARGET[learner.objective as ObjectiveName] : objective?.target);
    }),
    ...(parts.probe == null ? [] : checkProbe(parts.probe, parts.learnerNames)),
    ...noiseProblems(parts.noise, (kind) => (noiseKinds.get(kind) === undefined ? builtInNoiseKind(kind) : noiseKinds.get(kind))),
  );
  return problems;
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

/** A learner's own problems; `target` is how its objective uses target channels (undefined when the objective did not load). */
function checkLearner(learner: Learner, at: Path, target: TargetUse | undefined): ConfigProblem[] {
  const problems: ConfigProblem[] = [];
  const problem = (key: string, message: string) => problems.push({ path: [...at, key], message });
  learner.input.forEach((channel, i) => {
    if (learner.input.indexOf(channel) < i) problems.push({ path: [...at, 'input', i], message: `channel '${channel}' is listed twice` });
  });
  if (target === 'required' && (learner.target == null || learner.target.length === 0)) {
    problem('target', `required for objective '${learner.objective}': a non-empty list of channels`);
  }
  if (target === 'unused' && learner.target != null) {
    problem('target', `only objectives that use a target have one (predict, contrast, or a plug-in that asks for it); objective '${learner.objective}' does not use it`);
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
