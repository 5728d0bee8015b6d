import { headingFrame, leftOf, rightOf } from './heading.js';
import { isBlocked, step } from './movement.js';
import type { Action, Pose, Transition, World } from './types.js';

/**
 * The transition of an agent that is at `pose` just after taking `action`.
 *
 * A turn came from the neighbouring heading; `stay` changed nothing. For `forward`/`back`
 * the agent arrived by moving when the cell it came from is free; otherwise it must have
 * bumped where it stands, which needs the cell it pushed against to be blocked. Returns an
 * error message when neither is possible.
 */
export function arrivalTransition(world: World, pose: Pose, action: Action): Transition | string {
  if (action === 'stay') return { pose, moved: false, bumped: false };
  if (action === 'turn-left' || action === 'turn-right') {
    const before = action === 'turn-left' ? rightOf(pose.heading) : leftOf(pose.heading);
    return step(world, { ...pose, heading: before }, action);
  }
  const { fx, fy } = headingFrame(pose.heading);
  const sign = action === 'forward' ? 1 : -1;
  const from = { x: pose.x - sign * fx, y: pose.y - sign * fy, heading: pose.heading };
  if (!isBlocked(world, from.x, from.y)) return step(world, from, action);
  const into = step(world, pose, action);
  if (into.bumped) return into;
  return `cannot be at x=${pose.x}, y=${pose.y} facing ${pose.heading} just after '${action}': `
    + `the cell it came from is solid and the cell it pushed against is free`;
}
