import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';
import { HEADING_INDEX } from '../senses/heading-index.js';
import { sceneFor, type SensoryScene } from '../senses/scene.js';
import { visibleCell } from '../senses/sight.js';
import { headingFrame } from '../senses/sight-rays.js';
import { cellAhead } from '../world/movement.js';
import type { Pose, Transition } from '../world/types.js';
import { LATENT_NAMES, type LatentName } from './dataset.js';

/** Position of each latent in a latent row (LATENT_NAMES order). */
const AT = Object.fromEntries(LATENT_NAMES.map((name, i) => [name, i])) as Record<LatentName, number>;

function emitterInView(scene: SensoryScene, pose: Pose): boolean {
  for (let k = 0; k < scene.light.length; k++) {
    const cell = visibleCell(scene, pose, k);
    if (cell >= 0 && scene.world.emitterAt[cell] >= 0) return true;
  }
  return false;
}

/**
 * Writes the ground truth of one step into `row` (LATENT_NAMES order).
 *
 * The nearest emitter is by straight distance between cell centres (ties go to the first
 * listed), whether or not it is sounding; its azimuth is in degrees in (−180, 180], 0
 * straight ahead and positive to the agent's right; 0 when the agent stands on it.
 * material_ahead is the material of the cell in front (the floor under an emitter there).
 */
export function latentRow(scene: SensoryScene, pose: Pose, transition: Transition, row: Float64Array): void {
  const { world } = scene;
  const heading = HEADING_INDEX[pose.heading];
  let nearest = 0;
  let nearestCells = Infinity;
  world.emitters.forEach((e, i) => {
    const cells = Math.hypot(e.x - pose.x, e.y - pose.y);
    if (cells < nearestCells) { nearest = i; nearestCells = cells; }
  });
  const target = world.emitters[nearest];
  const { fx, fy, rx, ry } = headingFrame(heading);
  const dx = target.x - pose.x;
  const dy = target.y - pose.y;
  const azimuth = (Math.atan2(dx * rx + dy * ry, dx * fx + dy * fy) * 180) / Math.PI;
  const ahead = cellAhead(pose);
  const aheadCell = ahead.y * world.width + ahead.x;
  row[AT.x] = pose.x;
  row[AT.y] = pose.y;
  row[AT.heading] = heading;
  row[AT.material_under] = world.material[pose.y * world.width + pose.x];
  row[AT.material_ahead] = world.material[aheadCell];
  row[AT.wall_ahead] = world.solid[aheadCell];
  row[AT.nearest_emitter] = nearest;
  row[AT.nearest_distance_m] = nearestCells * world.cellSizeM;
  row[AT.nearest_azimuth_deg] = azimuth === -180 ? 180 : azimuth;
  row[AT.emitter_in_view] = emitterInView(scene, pose) ? 1 : 0;
  row[AT.moved] = transition.moved ? 1 : 0;
  row[AT.bumped] = transition.bumped ? 1 : 0;
}

/** Every latent at one pose as a record (categorical values are class indices, see Dataset). */
export function latentsAt(
  world: SensoryScene['world'], pose: Pose, transition: Transition, settings: SenseSettings = DEFAULT_SENSE_SETTINGS,
): Record<LatentName, number> {
  const row = new Float64Array(LATENT_NAMES.length);
  latentRow(sceneFor(world, settings), pose, transition, row);
  return Object.fromEntries(LATENT_NAMES.map((name, i) => [name, row[i]])) as Record<LatentName, number>;
}
