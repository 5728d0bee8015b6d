import { dirname, isAbsolute, relative, resolve } from 'node:path';
import { stringify } from 'yaml';
import { isPluginPath } from './plugin-bundle.js';
import type { Sweep } from './resolved-config.js';

/**
 * config.resolved.yaml: the config with every default filled in. It is itself a valid
 * config whose `out` is the output folder and whose world and plug-in paths are relative to it
 * (an absolute path stays as written), so `crosswise run <out>/config.resolved.yaml`
 * reproduces the sweep in place. A comment at the top lists each plug-in with the hash its
 * cells' identities hold.
 */
export function resolvedConfigYaml(sweep: Sweep): string {
  const { filled } = sweep;
  const base = sweep.combinations[0].settings;
  const fromOut = (path: string) => relative(sweep.out, resolve(dirname(sweep.configPath), path));
  const moved = (world: unknown) => (isAbsolute(String(world)) ? String(world) : fromOut(String(world)) || '.');
  const dotted = (path: string) => (path.startsWith('.') || isAbsolute(path) ? path : `./${path}`);
  /** A part as written, with a relative plug-in path made relative to the output folder. */
  const partAt = (value: string) => (isPluginPath(value) && !isAbsolute(value) ? dotted(fromOut(value)) : value);
  const varied = (key: string, values: unknown[]) => {
    if (key === 'world') return values.map(moved);
    return /\.(objective|rule|policy|kind)$/.test(key) ? values.map((v) => (typeof v === 'string' ? partAt(v) : v)) : values;
  };
  const resolved = {
    ...filled,
    world: moved(filled.world),
    collect: { ...filled.collect, policy: partAt(filled.collect.policy) },
    probe: { ...filled.probe, baseline: base.probe.baseline },
    learners: filled.learners.map((learner, i) => ({
      ...learner,
      objective: partAt(learner.objective),
      rule: partAt(learner.rule),
      ...(learner.objective === 'supervised' ? { supervised_targets: [...base.learners[i].spec.supervisedTargets] } : {}),
      control: base.learners[i].control,
    })),
    noise: filled.noise.map((entry) => ({ ...entry, kind: partAt(entry.kind) })),
    vary: Object.fromEntries(Object.entries(filled.vary).map(([key, values]) => [key, varied(key, values)])),
    out: '.',
  };
  const plugins = sweep.plugins.map((p) => `#   ${p.type} ${p.name}: ${dotted(relative(sweep.out, p.path))} sha256 ${p.sha256}\n`);
  const listed = plugins.length === 0 ? '' : `# Plug-ins (path relative to this file; SHA-256 of the file and every file it imports):\n${plugins.join('')}`;
  return `# Every setting of sweep '${filled.name}', defaults filled in (written by crosswise).\n${listed}${stringify(resolved)}`;
}
