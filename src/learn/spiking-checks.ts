import { SPIKING_RULES, type SpikingEncoderSpec } from './spec.js';

/** A problem with a spiking learner's settings: the config key (snake_case, under the learner) and why. */
export interface SpikingProblem {
  readonly key: readonly string[];
  readonly message: string;
}

/**
 * What keeps a spiking encoder with this rule from running: a rule without a spiking
 * version, or settings outside the model's range. Used by `check` and by the trainer.
 */
export function spikingProblems(encoder: SpikingEncoderSpec, rule: string): SpikingProblem[] {
  const problems: SpikingProblem[] = [];
  const problem = (key: string[], message: string) => problems.push({ key, message });
  if (!(SPIKING_RULES as readonly string[]).includes(rule)) {
    problem(['rule'], `rule '${rule}' cannot train a spiking encoder; expected one of ${SPIKING_RULES.join(' | ')}`);
  }
  if (!Number.isInteger(encoder.steps) || encoder.steps < 1) problem(['encoder', 'steps'], `expected a whole number ≥ 1, got ${encoder.steps}`);
  for (const [key, value] of [['dt_ms', encoder.dtMs], ['tau_ms', encoder.tauMs], ['threshold', encoder.threshold], ['surrogate_slope', encoder.surrogateSlope]] as const) {
    if (!(value > 0 && Number.isFinite(value))) problem(['encoder', key], `expected a finite value > 0, got ${value}`);
  }
  const refractorySteps = encoder.refractoryMs / encoder.dtMs;
  if (!(encoder.refractoryMs >= 0) || Math.abs(refractorySteps - Math.round(refractorySteps)) > 1e-9) {
    problem(['encoder', 'refractory_ms'], `expected 0 or a whole number of time steps (dt_ms = ${encoder.dtMs}), got ${encoder.refractoryMs}`);
  }
  return problems;
}
