import { randomInt, type Rng } from '../random.js';
import { ACTIONS as ACTION_LIST, type Action, type Transition } from '../world/types.js';

// A module-local copy: imported bindings cost a lookup on every access in the hot loop.
const ACTIONS = ACTION_LIST;

/** What a policy may look at: the outcome of the last action and the channels it was sensed with. */
export interface Observation {
  readonly transition: Transition;
  readonly sound: Float32Array; // [2, bands] dB, left ear first
  readonly touch: Float32Array; // [whisker_left, whisker_front, whisker_right, bump_force, footfall...]
}

/**
 * A behaviour policy, built in or default-exported by a plug-in file (`collect.policy:
 * ./my-policy.ts`): it chooses the agent's next action from what it just sensed.
 */
export interface PolicyDefinition {
  readonly type: 'policy';
  /** The name results and the summary show; letters, digits, '.', '_' or '-'. */
  readonly name: string;
  /** One line on how it behaves. */
  readonly description: string;
  /** The next action (forward, back, turn-left, turn-right or stay), drawing any randomness from `rng` only. */
  act(observation: Observation, rng: Rng): Action;
}

/** Behaviour policies by name. */
export const POLICY_NAMES = ['wander', 'uniform', 'seek'] as const;
export type PolicyName = (typeof POLICY_NAMES)[number];

/** Random turn, left or right with equal probability. */
function randomTurn(rng: Rng): Action {
  return rng() < 0.5 ? 'turn-left' : 'turn-right';
}

/**
 * A persistent random walk: when the front whisker touches a wall (or the last move bumped)
 * it turns left or right at random; otherwise it keeps going forward with probability 0.8,
 * turns with 0.16, and steps back or stays with 0.02 each, so every action appears in the
 * data while paths stay long and straight (probabilities are a design choice, common practice
 * for exploration walks).
 */
export const wander: PolicyDefinition = {
  type: 'policy',
  name: 'wander',
  description: 'a persistent random walk that turns at walls',
  act({ transition, touch }, rng) {
    if (touch[1] === 1 || transition.bumped) return randomTurn(rng);
    const u = rng();
    if (u < 0.8) return 'forward';
    if (u < 0.96) return randomTurn(rng);
    return u < 0.98 ? 'back' : 'stay';
  },
};

/** Each action with equal probability, whatever happens. */
export const uniform: PolicyDefinition = {
  type: 'policy',
  name: 'uniform',
  description: 'each action with equal probability',
  act: (_observation, rng) => ACTIONS[randomInt(rng, ACTIONS.length)],
};

/** Interaural difference (left minus right, dB of total power) above which seek turns. */
export const SEEK_TURN_DB = 1;
/** Probability that seek takes a uniform random action instead, so it escapes walls and dead ends. */
export const SEEK_EXPLORE = 0.1;

/**
 * Heads for the loudest source using its own ears only: it averages the interaural level
 * difference over all bands, turns towards the louder ear when the average exceeds
 * SEEK_TURN_DB, and goes forward otherwise; with probability SEEK_EXPLORE it acts at random.
 */
export const seek: PolicyDefinition = {
  type: 'policy',
  name: 'seek',
  description: 'heads for the loudest sound by its interaural level difference',
  act({ sound }, rng) {
    if (rng() < SEEK_EXPLORE) return ACTIONS[randomInt(rng, ACTIONS.length)];
    const bands = sound.length / 2;
    let sum = 0;
    for (let b = 0; b < bands; b++) sum += sound[b] - sound[bands + b];
    const differenceDb = sum / bands;
    if (differenceDb > SEEK_TURN_DB) return 'turn-left';
    if (differenceDb < -SEEK_TURN_DB) return 'turn-right';
    return 'forward';
  },
};

/** The built-in policies by name. */
export const POLICIES: Readonly<Record<PolicyName, PolicyDefinition>> = { wander, uniform, seek };
