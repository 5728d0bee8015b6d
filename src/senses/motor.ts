import { ACTIONS as ACTION_LIST, type Action } from '../world/types.js';

// A module-local copy: imported bindings cost a lookup on every access in the hot loop.
const ACTIONS = ACTION_LIST;

/** Writes the efference copy of `action` as a one-hot vector in ACTIONS order at `out[at..]`. */
export function senseMotor(action: Action, out: Float32Array, at: number): void {
  for (let i = 0; i < ACTIONS.length; i++) out[at + i] = ACTIONS[i] === action ? 1 : 0;
}
