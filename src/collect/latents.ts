import { DEFAULT_SENSE_SETTINGS, type SenseSettings } from '../senses/channel.js';
import { sceneFor, type SensoryScene } from '../senses/scene.js';
import { viewFrom } from '../senses/sight.js';
import { HEADING_INDEX, headingFrame, poseCount, type HeadingFrame } from '../world/heading.js';
import { cellAhead } from '../world/movement.js';
import type { Pose, Transition, World } from '../world/types.js';
import { LATENT_NAMES, type LatentName } from './dataset.js';

/** Position of each latent in a latent row (LATENT_NAMES order). */
const AT = Object.fromEntries(LATENT_NAMES.map((name, i) => [name, i])) as Record<LatentName, number>;

/**
 * Whether any emitter cell is visible in the sight field: each emitter's offset is turned
 * into field coordinates (rows ahead, columns across) and, when it falls inside the field,
 * checked along its line of sight.
 */
function emitterInView(scene: SensoryScene, pose: Pose, frame: HeadingFrame): boolean {
  const { width, depth } = scene.settings.sight;
  const emitters = scene.world.emitters;
  for (let e = 0; e < emitters.length; e++) {
    const dx = emitters[e].x - pose.x;
    const dy = emitters[e].y - pose.y;
    const ahead = dx * frame.fx + dy * frame.fy;
    const column = dx * frame.rx + dy * frame.ry + Math.floor(width / 2);
    if (ahead < 1 || ahead > depth || column < 0 || column >= width) continue;
    if (viewFrom(scene, pose)[(ahead - 1) * width + column] >= 0) return true;
  }
  return false;
}

/** Latents that depend on the pose alone, the first POSE_LATENTS of LATENT_NAMES; moved and bumped follow. */
export const POSE_LATENTS = AT.moved;

/**
 * Writes the latents that depend on the pose alone (LATENT_NAMES order, all but moved and
 * bumped) into `row[at..at + POSE_LATENTS)`.
 *
 * The nearest emitter is by straight distance between cell centres (ties go to the first
 * listed), whether or not it is sounding; its azimuth is in degrees in (−180, 180], 0
 * straight ahead and positive to the agent's right; 0 when the agent stands on it.
 * material_ahead is the material of the cell in front (the floor under an emitter there).
 */
export function poseLatents(scene: SensoryScene, pose: Pose, row: Float32Array | Float64Array, at = 0): void {
  const { world } = scene;
  let nearest = 0;
  let nearestSquared = Infinity;
  for (let e = 0; e < world.emitters.length; e++) {
    const dx = world.emitters[e].x - pose.x;
    const dy = world.emitters[e].y - pose.y;
    if (dx * dx + dy * dy < nearestSquared) { nearest = e; nearestSquared = dx * dx + dy * dy; }
  }
  const target = world.emitters[nearest];
  const frame = headingFrame(pose.heading);
  const { fx, fy, rx, ry } = frame;
  const dx = target.x - pose.x;
  const dy = target.y - pose.y;
  const azimuth = (Math.atan2(dx * rx + dy * ry, dx * fx + dy * fy) * 180) / Math.PI;
  const ahead = cellAhead(pose);
  const aheadCell = ahead.y * world.width + ahead.x;
  row[at + AT.x] = pose.x;
  row[at + AT.y] = pose.y;
  row[at + AT.heading] = HEADING_INDEX[pose.heading];
  row[at + AT.material_under] = world.material[pose.y * world.width + pose.x];
  row[at + AT.material_ahead] = world.material[aheadCell];
  row[at + AT.wall_ahead] = world.solid[aheadCell];
  row[at + AT.nearest_emitter] = nearest;
  row[at + AT.nearest_distance_m] = Math.sqrt(nearestSquared) * world.cellSizeM;
  row[at + AT.nearest_azimuth_deg] = azimuth === -180 ? 180 : azimuth;
  row[at + AT.emitter_in_view] = emitterInView(scene, pose, frame) ? 1 : 0;
}

/** Writes the ground truth of one step into `row` (LATENT_NAMES order). */
export function latentRow(scene: SensoryScene, pose: Pose, transition: Transition, row: Float64Array): void {
  poseLatents(scene, pose, row);
  row[AT.moved] = transition.moved ? 1 : 0;
  row[AT.bumped] = transition.bumped ? 1 : 0;
}

/** Every latent at one pose as a record (categorical values are class indices, see Dataset). */
export function latentsAt(
  world: World, pose: Pose, transition: Transition, settings: SenseSettings = DEFAULT_SENSE_SETTINGS,
): Record<LatentName, number> {
  const row = new Float64Array(LATENT_NAMES.length);
  latentRow(sceneFor(world, settings), pose, transition, row);
  return Object.fromEntries(LATENT_NAMES.map((name, i) => [name, row[i]])) as Record<LatentName, number>;
}

/** The pose-only latents of every pose visited, worked out on the first visit (the world is static). */
export class PoseLatentTable {
  /** [poses, POSE_LATENTS]; the row of pose p is valid once `rowOf(p, …)` has returned. */
  readonly rows: Float32Array;
  private readonly known: Uint8Array; // [poses]

  constructor(private readonly scene: SensoryScene) {
    const poses = poseCount(scene.world.width, scene.world.height);
    this.rows = new Float32Array(poses * POSE_LATENTS);
    this.known = new Uint8Array(poses);
  }

  /** The offset in `rows` of the pose-only latents of `pose`, whose pose index is p. */
  rowOf(p: number, pose: Pose): number {
    const at = p * POSE_LATENTS;
    if (this.known[p] === 0) {
      poseLatents(this.scene, pose, this.rows, at);
      this.known[p] = 1;
    }
    return at;
  }
}
