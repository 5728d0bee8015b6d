import { emitterIsOn } from '../world/emitter.js';
import { HEADING_INDEX, headingFrame } from '../world/heading.js';
import type { Pose, Transition } from '../world/types.js';
import { soundTableAt, type SensoryScene } from './scene.js';
import { FAR_EAST_WEST, FAR_NORTH_SOUTH, NEAR } from './sound-table.js';

/** Adds one source's band powers to both ears of `power` [2, bands]. */
function addToEars(power: Float64Array, source: Float32Array, leftFrom: number, rightFrom: number, bands: number): void {
  for (let b = 0; b < bands; b++) {
    power[b] += source[leftFrom + b];
    power[bands + b] += source[rightFrom + b];
  }
}

/**
 * Writes the binaural spectrum [2, bands] in dB at `out[at..]` (row 0 left ear, row 1 right).
 *
 * Sources add in power (incoherent sum, 10·log10 Σ 10^(L/10)): the ambient floor in every
 * band; each emitter that is on at `stepIndex`, with the far ear shadowed (sound-table.ts);
 * the agent's own footsteps on the material underfoot when it moved; a thud when it bumped.
 * Footsteps and the thud are heard equally by both ears (they come from below or straight
 * ahead/behind, where the level difference is zero).
 */
export function senseSound(
  scene: SensoryScene, pose: Pose, transition: Transition, stepIndex: number, out: Float32Array, at: number,
): void {
  const { world, power } = scene;
  const bands = scene.bandsHz.length;
  power.fill(scene.ambientPower);
  const { rx, ry } = headingFrame(pose.heading);
  const far = HEADING_INDEX[pose.heading] % 2 === 0 ? FAR_NORTH_SOUTH : FAR_EAST_WEST;
  const cell = pose.y * world.width + pose.x;
  const table = soundTableAt(scene, cell);
  for (let e = 0; e < world.emitters.length; e++) {
    const emitter = world.emitters[e];
    if (!emitterIsOn(emitter, stepIndex)) continue;
    const lateral = (emitter.x - pose.x) * rx + (emitter.y - pose.y) * ry; // > 0: source on the right
    const base = e * 3 * bands;
    addToEars(power, table, base + (lateral > 0 ? far : NEAR) * bands, base + (lateral < 0 ? far : NEAR) * bands, bands);
  }
  if (transition.moved) {
    const underfoot = world.material[cell] * bands;
    addToEars(power, scene.footstepPower, underfoot, underfoot, bands);
  }
  if (transition.bumped) addToEars(power, scene.thudPower, 0, 0, bands);
  for (let i = 0; i < 2 * bands; i++) out[at + i] = 10 * Math.log10(power[i]);
}
