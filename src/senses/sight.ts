import { HEADING_INDEX, poseIndex } from '../world/heading.js';
import type { Pose } from '../world/types.js';
import type { SensoryScene } from './scene.js';

/**
 * The map cell seen at sight-field cell k from `pose`, or −1 when it is off the map or
 * hidden: a line of sight is blocked by any solid (or off-map) cell strictly between the
 * agent and the target; the first solid cell on a line is itself visible.
 */
export function visibleCell(scene: SensoryScene, pose: Pose, k: number): number {
  const { world } = scene;
  const rays = scene.rays[HEADING_INDEX[pose.heading]];
  const tx = pose.x + rays.targetDx[k];
  const ty = pose.y + rays.targetDy[k];
  if (tx < 0 || ty < 0 || tx >= world.width || ty >= world.height) return -1;
  for (let j = rays.start[k]; j < rays.start[k + 1]; j++) {
    const bx = pose.x + rays.betweenDx[j];
    const by = pose.y + rays.betweenDy[j];
    if (bx < 0 || by < 0 || bx >= world.width || by >= world.height) return -1;
    if (world.solid[by * world.width + bx] === 1) return -1;
  }
  return ty * world.width + tx;
}

/** The map cell seen at every sight-field cell from `pose` (−1 where dark), computed once per pose. */
export function viewFrom(scene: SensoryScene, pose: Pose): Int32Array {
  const key = poseIndex(scene.world.width, pose);
  let view = scene.viewCells[key];
  if (view == null) {
    view = new Int32Array(scene.light.length);
    for (let k = 0; k < view.length; k++) view[k] = visibleCell(scene, pose, k);
    scene.viewCells[key] = view;
  }
  return view;
}

/**
 * Writes the sight field [depth, width, 3] at `out[at..]`: each visible cell's colour times
 * the lamp's illumination (sight-rays.ts); hidden and off-map cells are 0 (dark).
 */
export function senseSight(scene: SensoryScene, pose: Pose, out: Float32Array, at: number): void {
  const view = viewFrom(scene, pose);
  for (let k = 0; k < view.length; k++) {
    const cell = view[k];
    const o = at + 3 * k;
    if (cell < 0) {
      out[o] = 0; out[o + 1] = 0; out[o + 2] = 0;
      continue;
    }
    const light = scene.light[k];
    out[o] = scene.cellColour[3 * cell] * light;
    out[o + 1] = scene.cellColour[3 * cell + 1] * light;
    out[o + 2] = scene.cellColour[3 * cell + 2] * light;
  }
}
