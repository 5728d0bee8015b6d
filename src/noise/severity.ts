import type { NoiseKind, NoiseSpec } from './spec.js';

/** The highest severity that has a row in the table. */
export const MAX_SEVERITY = 5;

/**
 * The parameter of each kind at severities 1..5 (index 0 is severity 1). Severity 0 is
 * always the clean input and has no entry.
 *
 * | kind     | parameter                          | 1    | 2    | 3   | 4   | 5    |
 * | -------- | ---------------------------------- | ---- | ---- | --- | --- | ---- |
 * | gaussian | σ, in training std of each entry   | 0.25 | 0.5  | 1   | 2   | 4    |
 * | dropout  | fraction of entries silenced       | 0.1  | 0.3  | 0.5 | 0.7 | 0.9  |
 * | blackout | probability a row is silenced      | 0.1  | 0.3  | 0.5 | 0.7 | 0.9  |
 * | masking  | SNR in dB (sound only)             | 20   | 10   | 5   | 0   | −5   |
 *
 * Common practice, not from a published table: gaussian σ doubles per step, so the
 * scale is even in log σ and reaches a noise four times the signal's spread, the way
 * graded image corruptions grow roughly geometrically (Hendrycks & Dietterich 2019);
 * dropout and blackout step p evenly from mild to nearly total; masking spans the
 * speech-in-noise range from nearly clean (+20 dB) to noise louder than the signal
 * (−5 dB), where listening tests usually stop.
 */
export const SEVERITY_TABLE: Readonly<Record<NoiseKind, readonly number[]>> = {
  gaussian: [0.25, 0.5, 1, 2, 4],
  dropout: [0.1, 0.3, 0.5, 0.7, 0.9],
  blackout: [0.1, 0.3, 0.5, 0.7, 0.9],
  masking: [20, 10, 5, 0, -5],
};

/** The parameter that leaves the input unchanged (severity 0). */
export const CLEAN_PARAMETER: Readonly<Record<NoiseKind, number>> = {
  gaussian: 0,
  dropout: 0,
  blackout: 0,
  masking: Infinity,
};

/** The tabled parameter of a kind at a severity 0..5 (0 gives the clean parameter). */
export function severityParameter(kind: NoiseKind, severity: number): number {
  if (!Number.isInteger(severity) || severity < 0 || severity > MAX_SEVERITY) {
    throw new Error(`noise severity must be an integer from 0 to ${MAX_SEVERITY} (or give explicit parameters), got ${severity}`);
  }
  return severity === 0 ? CLEAN_PARAMETER[kind] : SEVERITY_TABLE[kind][severity - 1];
}

/**
 * The parameter a spec uses at its i-th severity: the explicit value if given (at
 * severity 0 validation allows only the clean one), else the table's.
 */
export function noiseParameter(spec: NoiseSpec, i: number): number {
  return spec.parameters === undefined ? severityParameter(spec.kind, spec.severities[i]) : spec.parameters[i];
}
