import type { Emitter, World } from './types.js';

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

/**
 * Clock steps until some emitter turns on or off, searched over the longest period; 1
 * when every emitter is steady.
 */
export function stepsToNextSwitch(world: World, stepIndex: number): number {
  const longest = Math.max(0, ...world.emitters.map((e) => e.periodSteps));
  const states = (t: number) => world.emitters.map((e) => emitterIsOn(e, t)).join();
  const now = states(stepIndex);
  for (let dt = 1; dt <= longest; dt++) if (states(stepIndex + dt) !== now) return dt;
  return 1;
}
