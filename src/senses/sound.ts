import { emitterIsOn } from '../world/emitter.js';
import type { Pose, Transition } from '../world/types.js';
import { HEADING_INDEX } from './heading-index.js';
import { soundTableAt, type SensoryScene } from './scene.js';
import { headingFrame } from './sight-rays.js';
import { FAR_EAST_WEST, FAR_NORTH_SOUTH, NEAR } from './sound-table.js';

function addBands(out: Float32Array, at: number, source: Float32Array, from: number, bands: number): void {
  for (let b = 0; b < bands; b++) out[at + b] += source[from + b];
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
  const { world, ambientPower } = scene;
  const bands = scene.bandsHz.length;
  const left = at;
  const right = at + bands;
  out.fill(ambientPower, at, at + 2 * bands);
  const heading = HEADING_INDEX[pose.heading];
  const { rx, ry } = headingFrame(heading);
  const far = heading % 2 === 0 ? FAR_NORTH_SOUTH : FAR_EAST_WEST;
  const cell = pose.y * world.width + pose.x;
  const table = soundTableAt(scene, cell);
  for (let e = 0; e < world.emitters.length; e++) {
    const emitter = world.emitters[e];
    if (!emitterIsOn(emitter, stepIndex)) continue;
    const lateral = (emitter.x - pose.x) * rx + (emitter.y - pose.y) * ry; // > 0: source on the right
    const base = e * 3 * bands;
    addBands(out, left, table, base + (lateral > 0 ? far : NEAR) * bands, bands);
    addBands(out, right, table, base + (lateral < 0 ? far : NEAR) * bands, bands);
  }
  if (transition.moved) {
    const underfoot = world.material[cell] * bands;
    addBands(out, left, scene.footstepPower, underfoot, bands);
    addBands(out, right, scene.footstepPower, underfoot, bands);
  }
  if (transition.bumped) {
    addBands(out, left, scene.thudPower, 0, bands);
    addBands(out, right, scene.thudPower, 0, bands);
  }
  for (let i = at; i < at + 2 * bands; i++) out[i] = 10 * Math.log10(out[i]);
}
