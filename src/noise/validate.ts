import { CHANNELS } from '../senses/channel.js';
import { kindChannels, NOISE_KIND_REGISTRY } from './corrupt.js';
import type { NoiseKindDefinition } from './kind-definition.js';
import { MAX_SEVERITY } from './severity.js';
import { NOISE_KINDS, type NoiseKind } from './spec.js';

/** A noise entry as a config's `noise` list holds it, before its names are known to be valid. */
export interface NoiseEntry {
  readonly channel: string;
  readonly kind: string;
  readonly severities: readonly number[];
  readonly parameters?: readonly number[];
}

/** One thing wrong with a noise list: the key path from `noise` down, and the reason. */
export interface NoiseProblem {
  readonly path: readonly (string | number)[];
  readonly message: string;
}

/**
 * The definition of a noise entry's kind as written: undefined for an unknown name, null for
 * one whose problem has already been reported (a plug-in file that did not load).
 */
export type NoiseKindLookup = (kind: string) => NoiseKindDefinition | null | undefined;

/** The built-in kinds by name. */
export const builtInNoiseKind: NoiseKindLookup = (kind) => NOISE_KIND_REGISTRY[kind as NoiseKind];
const yamlNumber = (p: number): string => (p === Infinity ? '.inf' : p === -Infinity ? '-.inf' : String(p));

/**
 * Every problem of a config's `noise` list, each at its key path (`noise.0.parameters.1`):
 * unknown names, a kind on a channel it cannot corrupt, severities that are not distinct
 * whole numbers ≥ 0, severities beyond the table without explicit parameters, a parameter
 * list whose length differs from the severities', a parameter outside its kind's range or
 * other than the clean value at severity 0, and two entries with the same channel and kind
 * (they would share result rows and noise draws). Empty when the list is valid. An
 * undefined entry (one its caller found malformed) is skipped but keeps its index.
 */
export function noiseProblems(entries: readonly (NoiseEntry | undefined)[], lookup: NoiseKindLookup = builtInNoiseKind): NoiseProblem[] {
  const problems = entries.flatMap((entry, i) => (entry == null ? [] : entryProblems(entry, ['noise', i], lookup)));
  const names = entries.map((entry) => (entry == null ? undefined : lookup(entry.kind)?.name ?? entry.kind));
  entries.forEach((entry, i) => {
    const first = entries.findIndex((other, j) => other?.channel === entry?.channel && names[j] === names[i]);
    if (entry != null && first < i) {
      problems.push({
        path: ['noise', i],
        message: `${entry.channel} ${names[i]} is already noise.${first}; entries with the same channel and kind would share result rows and noise draws`,
      });
    }
  });
  return problems;
}

/** Throws one line listing the problems of a noise list (for callers that bypass the config loader); a plug-in kind travels as its spec's definition. */
export function checkNoiseEntries(entries: readonly (NoiseEntry & { readonly definition?: NoiseKindDefinition })[]): void {
  const definitions = new Map(entries.flatMap((entry) => (entry.definition == null ? [] : [[entry.kind, entry.definition] as const])));
  const problems = noiseProblems(entries, (kind) => definitions.get(kind) ?? builtInNoiseKind(kind));
  if (problems.length > 0) throw new Error(problems.map((p) => `${p.path.join('.')}: ${p.message}`).join('; '));
}

function entryProblems(entry: NoiseEntry, at: readonly (string | number)[], lookup: NoiseKindLookup): NoiseProblem[] {
  const problem = (path: readonly (string | number)[], message: string): NoiseProblem[] => [{ path: [...at, ...path], message }];
  const { channel, severities, parameters } = entry;
  if (!(CHANNELS as readonly string[]).includes(channel)) return problem(['channel'], `expected one of ${CHANNELS.join(' | ')}, got '${channel}'`);
  const kind = lookup(entry.kind);
  if (kind === null) return [];
  if (kind === undefined) return problem(['kind'], `expected one of ${NOISE_KINDS.join(' | ')}, got '${entry.kind}'`);
  const problems: NoiseProblem[] = [];
  const channels = kindChannels(kind);
  if (!(channels as readonly string[]).includes(channel)) {
    problems.push(...problem(['channel'], `${kind.name} noise applies to ${channels.join(', ')} only, got '${channel}'`));
  }
  if (severities.length === 0) return [...problems, ...problem(['severities'], 'expected at least 1 severity, got an empty list')];
  severities.forEach((severity, j) => {
    if (!(Number.isInteger(severity) && severity >= 0)) problems.push(...problem(['severities', j], `expected a whole number ≥ 0, got ${severity}`));
    else if (severities.indexOf(severity) < j) problems.push(...problem(['severities', j], `severity ${severity} is listed twice`));
    else if (parameters == null && severity > MAX_SEVERITY) {
      problems.push(...problem(['severities', j], `severity ${severity} has no row in the severity table (0..${MAX_SEVERITY}); give explicit parameters`));
    }
  });
  if (parameters == null) return problems;
  if (parameters.length !== severities.length) {
    return [...problems, ...problem(['parameters'], `expected one value per severity (${severities.length}), got ${parameters.length}`)];
  }
  parameters.forEach((p, j) => {
    if (severities[j] === 0 && p !== kind.clean) {
      problems.push(...problem(['parameters', j], `severity 0 is the clean input, so its parameter must be ${yamlNumber(kind.clean)}, got ${yamlNumber(p)}`));
    } else if (!kind.valid(p)) {
      problems.push(...problem(['parameters', j], `expected ${kind.parameter}, got ${yamlNumber(p)}`));
    }
  });
  return problems;
}
