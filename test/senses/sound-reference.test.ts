import { describe, expect, it } from 'vitest';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { senseAll } from '../../src/senses/sense-all.js';
import { createRng, randomInt } from '../../src/random.js';
import { emitterIsOn } from '../../src/world/emitter.js';
import { solidCellsBetween } from '../../src/world/line.js';
import { loadWorld } from '../../src/world/parse.js';
import { HEADINGS, type Pose } from '../../src/world/types.js';

// An independent, naive recomputation of the binaural spectrum straight from the formulas
// (mel bands: O'Shaughnessy 1987; inverse-square law; ILD curve as documented in
// acoustics.ts after Feddersen et al. 1957), without the precomputed per-cell tables.
const world = loadWorld('worlds/workshop.yaml');
const mel = (f: number) => 2595 * Math.log10(1 + f / 700);
const low = mel(100);
const high = mel(8000);
const bandsHz = Array.from({ length: 16 }, (_, b) => 700 * (10 ** ((low + ((high - low) * b) / 15) / 2595) - 1));

function naiveSound(pose: Pose, stepIndex: number): [number[], number[]] {
  const left = bandsHz.map(() => 10 ** (world.ambientDb / 10));
  const right = [...left];
  const forward = { north: [0, -1], east: [1, 0], south: [0, 1], west: [-1, 0] }[pose.heading];
  for (const e of world.emitters) {
    if (!emitterIsOn(e, stepIndex)) continue;
    const dx = e.x - pose.x;
    const dy = e.y - pose.y;
    const distanceM = Math.max(0.25, Math.hypot(dx, dy) * world.cellSizeM);
    const walls = solidCellsBetween(world.solid, world.width, pose.x, pose.y, e.x, e.y);
    // Right = forward turned a quarter turn clockwise on a y-down map.
    const ahead = dx * forward[0] + dy * forward[1];
    const lateral = dx * -forward[1] + dy * forward[0];
    const azimuth = Math.atan2(lateral, ahead);
    bandsHz.forEach((f, b) => {
      const level = e.levelDb - 3 * ((2 * Math.log2(f / e.centreHz)) / e.bandwidthOctaves) ** 2
        - 20 * Math.log10(distanceM) - walls * world.wallLossDb;
      const ild = 20 * Math.abs(Math.sin(azimuth)) * (f / 1500) ** 2 / (1 + (f / 1500) ** 2);
      left[b] += 10 ** ((level - (lateral > 0 ? ild : 0)) / 10);
      right[b] += 10 ** ((level - (lateral < 0 ? ild : 0)) / 10);
    });
  }
  return [left.map((p) => 10 * Math.log10(p)), right.map((p) => 10 * Math.log10(p))];
}

describe('sound agrees with a naive recomputation from the formulas', () => {
  it('at 200 random free poses and steps of the workshop (tolerance 1e-3 dB)', () => {
    const rng = createRng(11, 'test');
    for (let n = 0; n < 200; n++) {
      let x = 0;
      let y = 0;
      do { x = randomInt(rng, world.width); y = randomInt(rng, world.height); } while (world.solid[y * world.width + x] === 1);
      const pose = { x, y, heading: HEADINGS[randomInt(rng, 4)] };
      const stepIndex = randomInt(rng, 120);
      const sound = senseAll(world, pose, { pose, moved: false, bumped: false }, 'stay', stepIndex, DEFAULT_SENSE_SETTINGS).sound;
      const [left, right] = naiveSound(pose, stepIndex);
      for (let b = 0; b < 16; b++) {
        expect(sound[b]).toBeCloseTo(left[b], 3);
        expect(sound[16 + b]).toBeCloseTo(right[b], 3);
      }
    }
  });
});
