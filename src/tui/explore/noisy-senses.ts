import { corruptChannel } from '../../noise/corrupt.js';
import { channelReference, type ChannelReference } from '../../noise/reference.js';
import { severityParameter } from '../../noise/severity.js';
import { createRng } from '../../random.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS, type ChannelName } from '../../senses/channel.js';
import { senseAll } from '../../senses/sense-all.js';
import { HEADINGS, type World } from '../../world/types.js';
import { step } from '../../world/movement.js';
import type { ExploreState } from './explore-state.js';

type Channels = Record<ChannelName, Float32Array>;

const references = new WeakMap<World, Record<ChannelName, ChannelReference>>();

/**
 * Channel spreads and silence levels the noise is scaled by. The explorer has no training
 * split, so it uses one step forward from every free cell in every heading, with the
 * clock at the row number so duty-cycled emitters are heard both on and off.
 */
export function referenceFor(world: World): Record<ChannelName, ChannelReference> {
  const cached = references.get(world);
  if (cached != null) return cached;
  const rows: Channels[] = [];
  for (let cell = 0; cell < world.width * world.height; cell++) {
    if (world.solid[cell] === 1) continue;
    for (const heading of HEADINGS) {
      const pose = { x: cell % world.width, y: Math.floor(cell / world.width), heading };
      const transition = step(world, pose, 'forward');
      rows.push(senseAll(world, transition.pose, transition, 'forward', rows.length, DEFAULT_SENSE_SETTINGS));
    }
  }
  const all = Int32Array.from(rows.keys());
  const reference = Object.fromEntries(CHANNELS.map((c) => {
    const size = rows[0][c].length;
    const values = new Float32Array(rows.length * size);
    rows.forEach((r, i) => values.set(r[c], i * size));
    return [c, channelReference(values, size, all, c)];
  })) as Record<ChannelName, ChannelReference>;
  references.set(world, reference);
  return reference;
}

/**
 * What the agent senses in this state, each channel corrupted as its noise setting says.
 * Draws come from the seed, world, clock and channel, so a redraw shows the same noise.
 */
export function noisySenses(state: ExploreState): Channels {
  const world = state.worlds[state.worldIndex];
  const clean = senseAll(world, state.pose, state.transition, state.action, state.stepIndex, DEFAULT_SENSE_SETTINGS);
  const out = { ...clean };
  for (const channel of CHANNELS) {
    const { kind, severity } = state.noise[channel];
    if (severity === 0) continue;
    const rng = createRng(state.seed, 'explore', state.worldIndex, state.stepIndex, channel, kind, severity);
    const reference = referenceFor(world)[channel];
    out[channel] = corruptChannel(clean[channel], clean[channel].length, kind, severityParameter(kind, severity), reference, rng);
  }
  return out;
}
