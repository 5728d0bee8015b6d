import { headingFrame, leftOf, rightOf } from './heading.js';
import type { Action, Pose, Transition, World } from './types.js';

/** The cell directly in front of a pose (it may lie off the map). */
export function cellAhead(pose: Pose): { readonly x: number; readonly y: number } {
  const { fx, fy } = headingFrame(pose.heading);
  return { x: pose.x + fx, y: pose.y + fy };
}

/** True when (x, y) is off the map or solid: a cell the agent cannot enter. */
export function isBlocked(world: World, x: number, y: number): boolean {
  if (x < 0 || y < 0 || x >= world.width || y >= world.height) return true;
  return world.solid[y * world.width + x] === 1;
}

/**
 * Applies one action: forward/back move one cell along the heading, turns rotate a quarter
 * turn in place, stay does nothing. A move into a solid or off-map cell leaves the pose and
 * counts as a bump.
 */
export function step(world: World, pose: Pose, action: Action): Transition {
  if (action === 'stay') return { pose, moved: false, bumped: false };
  if (action === 'turn-left' || action === 'turn-right') {
    const heading = action === 'turn-left' ? leftOf(pose.heading) : rightOf(pose.heading);
    return { pose: { ...pose, heading }, moved: false, bumped: false };
  }
  const { fx, fy } = headingFrame(pose.heading);
  const sign = action === 'forward' ? 1 : -1;
  const x = pose.x + sign * fx;
  const y = pose.y + sign * fy;
  if (isBlocked(world, x, y)) return { pose, moved: false, bumped: true };
  return { pose: { x, y, heading: pose.heading }, moved: true, bumped: false };
}
