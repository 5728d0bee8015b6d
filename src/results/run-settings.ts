import { existsSync, readFileSync } from 'node:fs';
import { parse as parseYaml } from 'yaml';
import { SEED_MEASURES, type SeedMeasure } from '../probe/robustness.js';
import { outputPath } from './layout.js';

/** What the report takes from config.resolved.yaml. */
export interface RunSettings {
  readonly name: string;
  /** The learner paired tests compare against; null when the config names none. */
  readonly baseline: string | null;
  /** The measure of the primary family; null when the file names none. */
  readonly primary: SeedMeasure | null;
  /** Each learner's `control` setting, by name, where the file gives one. */
  readonly controls: ReadonlyMap<string, boolean>;
  /** How many probe targets and noise entries the config lists (the planned primary family's factors); null when absent. */
  readonly targets: number | null;
  readonly noises: number | null;
}

/** Reads config.resolved.yaml; anything missing becomes a warning and a neutral value. */
export function readRunSettings(out: string, warnings: string[]): RunSettings {
  const path = outputPath(out, 'config');
  if (!existsSync(path)) {
    warnings.push(`${path}: not found`);
    return { name: 'crosswise run', baseline: null, primary: null, controls: new Map(), targets: null, noises: null };
  }
  const doc: unknown = parseYaml(readFileSync(path, 'utf8'), { merge: true });
  const record = (v: unknown): Record<string, unknown> => (typeof v === 'object' && v != null ? v as Record<string, unknown> : {});
  const { name, probe, learners, noise } = record(doc);
  const { baseline, primary, targets } = record(probe);
  const controls = new Map<string, boolean>();
  for (const learner of Array.isArray(learners) ? learners : []) {
    const { name: learnerName, control } = record(learner);
    if (typeof learnerName === 'string' && typeof control === 'boolean') controls.set(learnerName, control);
  }
  return {
    name: typeof name === 'string' ? name : 'crosswise run',
    baseline: typeof baseline === 'string' ? baseline : null,
    primary: (SEED_MEASURES as readonly unknown[]).includes(primary) ? primary as SeedMeasure : null,
    controls,
    targets: Array.isArray(targets) ? targets.length : null,
    noises: Array.isArray(noise) ? noise.length : null,
  };
}
