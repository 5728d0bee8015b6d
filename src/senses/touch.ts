import { headingFrame } from '../world/heading.js';
import { isBlocked } from '../world/movement.js';
import { TEXTURE_SIZE, type Pose, type Transition, type World } from '../world/types.js';

/** Names of the touch entries, in channel order. */
export const TOUCH_NAMES: readonly string[] = [
  'whisker_left', 'whisker_front', 'whisker_right', 'bump_force',
  ...Array.from({ length: TEXTURE_SIZE }, (_, i) => `footfall_${i}`),
];

/**
 * Writes the touch vector at `out[at..]`: whisker contacts (1 when the adjacent cell on the
 * left, in front, on the right is solid or off the map), bump force (1 on a bump, in units
 * of one full-speed bump, else 0), then the footfall vibration spectrum, which is the
 * texture of the material underfoot when the agent moved and 0 otherwise.
 */
export function senseTouch(world: World, pose: Pose, transition: Transition, out: Float32Array, at: number): void {
  const { fx, fy, rx, ry } = headingFrame(pose.heading);
  out[at] = isBlocked(world, pose.x - rx, pose.y - ry) ? 1 : 0;
  out[at + 1] = isBlocked(world, pose.x + fx, pose.y + fy) ? 1 : 0;
  out[at + 2] = isBlocked(world, pose.x + rx, pose.y + ry) ? 1 : 0;
  out[at + 3] = transition.bumped ? 1 : 0;
  const texture = world.materials[world.material[pose.y * world.width + pose.x]].texture;
  for (let i = 0; i < texture.length; i++) out[at + 4 + i] = transition.moved ? texture[i] : 0;
}
