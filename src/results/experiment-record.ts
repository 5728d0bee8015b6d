import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { z } from 'zod';
import { canonicalJson, cellIdentitySchema, type CellIdentity } from './cell-identity.js';
import { RESULTS_FORMAT_VERSION } from './format-version.js';
import { outputPath } from './layout.js';

/** The output folder is busy, or belongs to another experiment or results format: exit code 4, nothing written. */
export class OutputBusyError extends Error {
  override name = 'OutputBusyError';
}

/** The settings of one arm of an experiment: a cell's identity without its seed. */
const armIdentitySchema = cellIdentitySchema.omit({ seed: true });

/** A cell's identity without its seed: what every seed of one learner and vary combination shares. */
export type ArmIdentity = z.infer<typeof armIdentitySchema>;

/**
 * experiment.json: the experiment that owns an output folder, and the results format it
 * was written in. An arm is one learner in one vary combination; its identity is that of
 * its cells without the seed. Seeds, learners and vary values may be added (the sweep
 * grows); an arm whose settings change is another experiment.
 */
export const experimentRecordSchema = z.object({
  format_version: z.literal(RESULTS_FORMAT_VERSION),
  vary_keys: z.array(z.string()),
  arms: z.array(armIdentitySchema),
});

/** The contents of experiment.json. */
export type ExperimentRecord = z.infer<typeof experimentRecordSchema>;

/** What an output folder says about its owner. */
export type FolderOwner =
  | { readonly kind: 'none' }
  | { readonly kind: 'experiment'; readonly record: ExperimentRecord }
  /** Written by another results format (`version` null: older than experiment.json). */
  | { readonly kind: 'other-format'; readonly version: number | null }
  | { readonly kind: 'unreadable'; readonly reason: string };

/** An arm's identity: a cell's identity without the seed. */
export function armIdentity(identity: CellIdentity): ArmIdentity {
  const { seed: _, ...arm } = identity;
  return arm;
}

/** The key of an arm: its learner's name and its vary values. */
export function armKey(arm: { readonly learner: { readonly name: string }; readonly vary: Readonly<Record<string, string>> }): string {
  return canonicalJson({ learner: arm.learner.name, vary: arm.vary });
}

/** experiment.json text: two-space indented JSON ending in a line break. */
export function formatExperimentRecord(record: ExperimentRecord): string {
  return `${JSON.stringify(record, null, 2)}\n`;
}

/** Reads who owns an output folder; never throws. */
export function readFolderOwner(out: string): FolderOwner {
  const path = outputPath(out, 'experiment');
  if (!existsSync(path)) return olderThanExperimentJson(out) ? { kind: 'other-format', version: null } : { kind: 'none' };
  let json: unknown;
  try {
    json = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    return { kind: 'unreadable', reason: `experiment.json: ${(error as Error).message}` };
  }
  const version = (json as { format_version?: unknown } | null)?.format_version;
  if (version !== RESULTS_FORMAT_VERSION) return { kind: 'other-format', version: typeof version === 'number' ? version : null };
  const parsed = experimentRecordSchema.safeParse(json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return { kind: 'unreadable', reason: `experiment.json: ${issue.path.join('.') || '(top level)'}: ${issue.message}` };
  }
  return { kind: 'experiment', record: parsed.data };
}

/** Output folders of formats before experiment.json had a plan.csv or cells but no experiment.json. */
function olderThanExperimentJson(out: string): boolean {
  if (existsSync(outputPath(out, 'plan'))) return true;
  const cells = outputPath(out, 'cells');
  return existsSync(cells) && readdirSync(cells).some((name) => !name.startsWith('.'));
}

/** Why a folder of another results format is not read, and how to recompute its cells. */
export function otherFormatMessage(out: string, version: number | null): string {
  const written = version == null ? `an older crosswise (a results format before ${RESULTS_FORMAT_VERSION})` : `results format ${version}`;
  return `${out} was written by ${written}; this crosswise reads format ${RESULTS_FORMAT_VERSION} and does not reuse those cells. `
    + 'To recompute them, run the config again with --out <new folder>';
}

/**
 * Why the stored experiment cannot take the current one's cells, as one phrase, or null
 * when the current one only extends it (same vary keys, and every arm both have with
 * the same settings).
 */
export function experimentConflict(stored: ExperimentRecord, current: ExperimentRecord): string | null {
  if (canonicalJson(stored.vary_keys) !== canonicalJson(current.vary_keys)) {
    return `its vary keys are ${listed(stored.vary_keys)}, this config's ${listed(current.vary_keys)}`;
  }
  const storedArms = new Map(stored.arms.map((arm) => [armKey(arm), arm]));
  for (const arm of current.arms) {
    const there = storedArms.get(armKey(arm));
    const difference = there == null ? null : firstDifference(arm, there, []);
    if (difference != null) {
      const vary = Object.entries(arm.vary).map(([key, value]) => ` ${key}=${value}`).join('');
      return `learner '${arm.learner.name}'${vary === '' ? '' : ` (${vary.trim()})`} has other settings there: ${difference}`;
    }
  }
  return null;
}

/** The stored experiment grown by the current one's new arms (stored arms first). */
export function extendExperiment(stored: ExperimentRecord, current: ExperimentRecord): ExperimentRecord {
  const known = new Set(stored.arms.map(armKey));
  return { ...stored, arms: [...stored.arms, ...current.arms.filter((arm) => !known.has(armKey(arm)))] };
}

function listed(keys: readonly string[]): string {
  return keys.length === 0 ? '(none)' : keys.join(', ');
}

/** `path: <here> here, <there> there` for the first leaf where two JSON values differ, or null. */
function firstDifference(here: unknown, there: unknown, path: readonly string[]): string | null {
  if (canonicalJson(here) === canonicalJson(there)) return null;
  const isObject = (v: unknown): v is Record<string, unknown> => v != null && typeof v === 'object' && !Array.isArray(v);
  if (isObject(here) && isObject(there)) {
    for (const key of [...new Set([...Object.keys(here), ...Object.keys(there)])].sort()) {
      const found = firstDifference(here[key], there[key], [...path, key]);
      if (found != null) return found;
    }
  }
  const shown = (v: unknown) => (v === undefined ? 'absent' : canonicalJson(v));
  return `${path.join('.') || '(all)'}: ${shown(here)} here, ${shown(there)} there`;
}
