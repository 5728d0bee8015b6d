import type { Action, Heading, Pose, Transition, World } from './types.js';

/** One cell along a heading as [dx, dy]; y grows southwards (down the map). */
export function headingVector(heading: Heading): readonly [number, number] {
  switch (heading) {
    case 'north': return [0, -1];
    case 'east': return [1, 0];
    case 'south': return [0, 1];
    case 'west': return [-1, 0];
  }
}

/** The cell directly in front of a pose (it may lie off the map). */
export function cellAhead(pose: Pose): { readonly x: number; readonly y: number } {
  const [dx, dy] = headingVector(pose.heading);
  return { x: pose.x + dx, y: pose.y + dy };
}

/** True when (x, y) is off the map or solid: a cell the agent cannot enter. */
export function isBlocked(world: World, x: number, y: number): boolean {
  if (x < 0 || y < 0 || x >= world.width || y >= world.height) return true;
  return world.solid[y * world.width + x] === 1;
}

const LEFT_OF: Readonly<Record<Heading, Heading>> = { north: 'west', west: 'south', south: 'east', east: 'north' };
const RIGHT_OF: Readonly<Record<Heading, Heading>> = { north: 'east', east: 'south', south: 'west', west: 'north' };

/**
 * Applies one action: forward/back move one cell along the heading, turns rotate a quarter
 * turn in place, stay does nothing. A move into a solid or off-map cell leaves the pose and
 * counts as a bump.
 */
export function step(world: World, pose: Pose, action: Action): Transition {
  if (action === 'stay') return { pose, moved: false, bumped: false };
  if (action === 'turn-left' || action === 'turn-right') {
    const heading = action === 'turn-left' ? LEFT_OF[pose.heading] : RIGHT_OF[pose.heading];
    return { pose: { ...pose, heading }, moved: false, bumped: false };
  }
  const [dx, dy] = headingVector(pose.heading);
  const sign = action === 'forward' ? 1 : -1;
  const x = pose.x + sign * dx;
  const y = pose.y + sign * dy;
  if (isBlocked(world, x, y)) return { pose, moved: false, bumped: true };
  return { pose: { x, y, heading: pose.heading }, moved: true, bumped: false };
}
