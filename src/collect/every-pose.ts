import { CHANNELS, type ChannelName, type SenseSettings } from '../senses/channel.js';
import { senseAll } from '../senses/sense-all.js';
import { step } from '../world/movement.js';
import { HEADINGS, type World } from '../world/types.js';

/**
 * What the agent senses one step forward from every free cell in every heading, with the
 * clock at the row number so duty-cycled emitters are heard both on and off: a
 * policy-free sample of a world's sensory range, for scaling noise where there is no
 * training split. Each channel is [rows, channelSize].
 */
export function everyPoseSample(world: World, settings: SenseSettings): { rows: number; channels: Record<ChannelName, Float32Array> } {
  const samples: Record<ChannelName, Float32Array>[] = [];
  for (let cell = 0; cell < world.width * world.height; cell++) {
    if (world.solid[cell] === 1) continue;
    for (const heading of HEADINGS) {
      const pose = { x: cell % world.width, y: Math.floor(cell / world.width), heading };
      const transition = step(world, pose, 'forward');
      samples.push(senseAll(world, transition.pose, transition, 'forward', samples.length, settings));
    }
  }
  const channels = Object.fromEntries(CHANNELS.map((c) => {
    const size = samples[0][c].length;
    const values = new Float32Array(samples.length * size);
    samples.forEach((sample, i) => values.set(sample[c], i * size));
    return [c, values];
  })) as Record<ChannelName, Float32Array>;
  return { rows: samples.length, channels };
}
