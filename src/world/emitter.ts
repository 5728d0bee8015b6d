import type { Emitter } from './types.js';

/**
 * Whether an emitter sounds at a step of the world clock.
 *
 * `periodSteps` 0 means always on. Otherwise the emitter is on for the first
 * round(duty × period) steps of each period and off for the rest, so period 4, duty 0.25
 * ticks on steps 0, 4, 8, ... Negative steps wrap the same way.
 */
export function emitterIsOn(emitter: Emitter, stepIndex: number): boolean {
  if (emitter.periodSteps === 0) return true;
  const phase = ((stepIndex % emitter.periodSteps) + emitter.periodSteps) % emitter.periodSteps;
  return phase < Math.round(emitter.duty * emitter.periodSteps);
}
