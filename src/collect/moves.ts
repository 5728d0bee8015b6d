import { poseCount, poseIndex } from '../world/heading.js';
import { step } from '../world/movement.js';
import { ACTIONS, type Action, type Pose, type Transition, type World } from '../world/types.js';

/** Outcomes per pose: 0 neither moved nor bumped, 1 moved, 2 bumped. */
const OUTCOMES = 3;

const ACTION_INDEX = Object.fromEntries(ACTIONS.map((a, i) => [a, i])) as Record<Action, number>;

/**
 * The transitions of a static world, worked out with `step` the first time a pose and
 * action meet and shared after that, so a long walk allocates no poses or transitions.
 * A transition is named by its number k = pose index · 3 + outcome.
 */
export class MoveTable {
  private readonly transitions: (Transition | undefined)[];
  /** [poses, actions]: the transition number + 1 that an action leads to, 0 until first taken. */
  private readonly after: Int32Array;

  constructor(private readonly world: World) {
    this.transitions = new Array(poseCount(world.width, world.height) * OUTCOMES);
    this.after = new Int32Array(poseCount(world.width, world.height) * ACTIONS.length);
  }

  /** Standing at `pose` without having moved or bumped (an episode's first step). */
  rest(pose: Pose): number {
    return this.remember({ pose, moved: false, bumped: false });
  }

  /** The transition that taking `action` from the pose of transition k leads to. */
  take(k: number, action: Action): number {
    const slot = Math.floor(k / OUTCOMES) * ACTIONS.length + ACTION_INDEX[action];
    let next = this.after[slot] - 1;
    if (next < 0) {
      next = this.remember(step(this.world, this.transition(k).pose, action));
      this.after[slot] = next + 1;
    }
    return next;
  }

  /** Transition number k as the object `step` returned for it. */
  transition(k: number): Transition {
    const transition = this.transitions[k];
    if (transition == null) throw new Error(`transition ${k} has not been taken`);
    return transition;
  }

  private remember(transition: Transition): number {
    const outcome = transition.moved ? 1 : transition.bumped ? 2 : 0;
    const k = poseIndex(this.world.width, transition.pose) * OUTCOMES + outcome;
    this.transitions[k] ??= transition;
    return k;
  }
}

/** The pose index of transition number k. */
export function poseOf(k: number): number {
  return Math.floor(k / OUTCOMES);
}
