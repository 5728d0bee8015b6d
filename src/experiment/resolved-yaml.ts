import { dirname, isAbsolute, relative, resolve } from 'node:path';
import { stringify } from 'yaml';
import type { Sweep } from './resolved-config.js';

/**
 * config.resolved.yaml: the config with every default filled in. It is itself a valid
 * config whose `out` is the output folder and whose world paths are relative to it (an
 * absolute path stays as written), so `crosswise run <out>/config.resolved.yaml`
 * reproduces the sweep in place.
 */
export function resolvedConfigYaml(sweep: Sweep): string {
  const { filled } = sweep;
  const base = sweep.combinations[0].settings;
  const moved = (world: unknown) => (isAbsolute(String(world)) ? String(world) : relative(sweep.out, resolve(dirname(sweep.configPath), String(world))) || '.');
  const resolved = {
    ...filled,
    world: moved(filled.world),
    probe: { ...filled.probe, baseline: base.probe.baseline },
    learners: filled.learners.map((learner, i) => ({
      ...learner,
      ...(learner.objective === 'supervised' ? { supervised_targets: [...base.learners[i].spec.supervisedTargets] } : {}),
      control: base.learners[i].control,
    })),
    vary: filled.vary.world == null ? filled.vary : { ...filled.vary, world: filled.vary.world.map(moved) },
    out: '.',
  };
  return `# Every setting of sweep '${filled.name}', defaults filled in (written by crosswise).\n${stringify(resolved)}`;
}
