import { existsSync, readFileSync } from 'node:fs';
import { parse as parseYaml } from 'yaml';
import { outputPath } from './layout.js';

/** What the report takes from config.resolved.yaml. */
export interface RunSettings {
  readonly name: string;
  /** The learner paired tests compare against; null when the config names none. */
  readonly baseline: string | null;
}

/** Reads config.resolved.yaml; anything missing becomes a warning and a neutral value. */
export function readRunSettings(out: string, warnings: string[]): RunSettings {
  const path = outputPath(out, 'config');
  if (!existsSync(path)) {
    warnings.push(`${path}: not found`);
    return { name: 'crosswise run', baseline: null };
  }
  const doc: unknown = parseYaml(readFileSync(path, 'utf8'), { merge: true });
  const record = (v: unknown): Record<string, unknown> => (typeof v === 'object' && v != null ? v as Record<string, unknown> : {});
  const name = record(doc).name;
  const baseline = record(record(doc).probe).baseline;
  return { name: typeof name === 'string' ? name : 'crosswise run', baseline: typeof baseline === 'string' ? baseline : null };
}
