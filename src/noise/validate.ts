import { CHANNELS } from '../senses/channel.js';
import { NOISE_CHANNELS } from './corrupt.js';
import { CLEAN_PARAMETER, MAX_SEVERITY } from './severity.js';
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

/** What each kind's parameter means and which values it allows. */
const PARAMETER_RULE: Readonly<Record<NoiseKind, { readonly meaning: string; readonly valid: (p: number) => boolean }>> = {
  gaussian: { meaning: 'a std multiple σ ≥ 0', valid: (p) => Number.isFinite(p) && p >= 0 },
  dropout: { meaning: 'a fraction p in [0, 1]', valid: (p) => p >= 0 && p <= 1 },
  blackout: { meaning: 'a probability p in [0, 1]', valid: (p) => p >= 0 && p <= 1 },
  masking: { meaning: 'an SNR in dB (a finite number, or .inf for clean)', valid: (p) => p === Infinity || Number.isFinite(p) },
};

const isKind = (kind: string): kind is NoiseKind => (NOISE_KINDS as readonly string[]).includes(kind);
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
export function noiseProblems(entries: readonly (NoiseEntry | undefined)[]): NoiseProblem[] {
  const problems = entries.flatMap((entry, i) => (entry == null ? [] : entryProblems(entry, ['noise', i])));
  entries.forEach((entry, i) => {
    const first = entries.findIndex((other) => other?.channel === entry?.channel && other?.kind === entry?.kind);
    if (entry != null && first < i) {
      problems.push({
        path: ['noise', i],
        message: `${entry.channel} ${entry.kind} is already noise.${first}; entries with the same channel and kind would share result rows and noise draws`,
      });
    }
  });
  return problems;
}

/** Throws one line listing the problems of a noise list (for callers that bypass the config loader). */
export function checkNoiseEntries(entries: readonly NoiseEntry[]): void {
  const problems = noiseProblems(entries);
  if (problems.length > 0) throw new Error(problems.map((p) => `${p.path.join('.')}: ${p.message}`).join('; '));
}

function entryProblems(entry: NoiseEntry, at: readonly (string | number)[]): NoiseProblem[] {
  const problem = (path: readonly (string | number)[], message: string): NoiseProblem[] => [{ path: [...at, ...path], message }];
  const { channel, kind, severities, parameters } = entry;
  if (!(CHANNELS as readonly string[]).includes(channel)) return problem(['channel'], `expected one of ${CHANNELS.join(' | ')}, got '${channel}'`);
  if (!isKind(kind)) return problem(['kind'], `expected one of ${NOISE_KINDS.join(' | ')}, got '${kind}'`);
  const problems: NoiseProblem[] = [];
  if (!(NOISE_CHANNELS[kind] as readonly string[]).includes(channel)) {
    problems.push(...problem(['channel'], `${kind} noise applies to ${NOISE_CHANNELS[kind].join(', ')} only, got '${channel}'`));
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
    const clean = CLEAN_PARAMETER[kind];
    if (severities[j] === 0 && p !== clean) {
      problems.push(...problem(['parameters', j], `severity 0 is the clean input, so its parameter must be ${yamlNumber(clean)}, got ${yamlNumber(p)}`));
    } else if (!PARAMETER_RULE[kind].valid(p)) {
      problems.push(...problem(['parameters', j], `expected ${PARAMETER_RULE[kind].meaning}, got ${yamlNumber(p)}`));
    }
  });
  return problems;
}
