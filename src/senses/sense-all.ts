import type { Action, Pose, Transition, World } from '../world/types.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS, type ChannelName, type SenseSettings } from './channel.js';
import { senseMotor } from './motor.js';
import { channelSize } from './registry.js';
import { sceneFor, type SensoryScene } from './scene.js';
import { senseSight } from './sight.js';
import { senseSound } from './sound.js';
import { senseTouch } from './touch.js';

/** Output buffers and the row to write, for sensing straight into a dataset. */
export type ChannelRows = Readonly<Record<ChannelName, Float32Array>>;

/**
 * Writes every channel of one step into row `row` of `out` (each buffer [steps, size]).
 * `pose` is where the agent is after `action`; `transition` says whether it moved or bumped.
 */
export function senseInto(
  scene: SensoryScene, pose: Pose, transition: Transition, action: Action, stepIndex: number,
  out: ChannelRows, row: number,
): void {
  const { sizes } = scene;
  senseSight(scene, pose, out.sight, row * sizes.sight);
  senseSound(scene, pose, transition, stepIndex, out.sound, row * sizes.sound);
  senseTouch(scene.world, pose, transition, out.touch, row * sizes.touch);
  senseMotor(action, out.motor, row * sizes.motor);
}

/** Every channel at one step, each as a fresh flat array in the channel's shape (registry.ts). */
export function senseAll(
  world: World, pose: Pose, transition: Transition, action: Action, stepIndex: number,
  settings: SenseSettings = DEFAULT_SENSE_SETTINGS,
): Record<ChannelName, Float32Array> {
  const out = Object.fromEntries(CHANNELS.map((c) => [c, new Float32Array(channelSize(c, settings))])) as Record<ChannelName, Float32Array>;
  senseInto(sceneFor(world, settings), pose, transition, action, stepIndex, out, 0);
  return out;
}
