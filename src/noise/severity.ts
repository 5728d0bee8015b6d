import { noiseKindOf } from './corrupt.js';
import type { NoiseKindDefinition } from './kind-definition.js';
import type { NoiseKind, NoiseSpec } from './spec.js';

/** The highest severity that has a row in the table (each kind's `severities`, see kinds.ts). */
export const MAX_SEVERITY = 5;

/** The tabled parameter of a kind at a severity 0..5 (0 gives the clean parameter). */
export function severityParameter(kind: NoiseKind | NoiseKindDefinition, severity: number): number {
  if (!Number.isInteger(severity) || severity < 0 || severity > MAX_SEVERITY) {
    throw new Error(`noise severity must be an integer from 0 to ${MAX_SEVERITY} (or give explicit parameters), got ${severity}`);
  }
  const definition = typeof kind === 'string' ? noiseKindOf({ kind }) : kind;
  return severity === 0 ? definition.clean : definition.severities[severity - 1];
}

/**
 * The parameter a spec uses at its i-th severity: the explicit value if given (at
 * severity 0 validation allows only the clean one), else the table's.
 */
export function noiseParameter(spec: NoiseSpec, i: number): number {
  return spec.parameters === undefined ? severityParameter(noiseKindOf(spec), spec.severities[i]) : spec.parameters[i];
}
