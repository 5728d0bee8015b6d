import { corruptChannel } from '../../noise/corrupt.js';
import { channelReference, type ChannelReference } from '../../noise/reference.js';
import { severityParameter } from '../../noise/severity.js';
import { createRng } from '../../random.js';
import { CHANNELS, DEFAULT_SENSE_SETTINGS, type ChannelName } from '../../senses/channel.js';
import { senseAll } from '../../senses/sense-all.js';
import type { World } from '../../world/types.js';
import { everyPoseSample } from '../../collect/every-pose.js';
import type { ExploreState } from './explore-state.js';

type Channels = Record<ChannelName, Float32Array>;

const references = new WeakMap<World, Record<ChannelName, ChannelReference>>();

/** Channel spreads and silence levels the noise is scaled by: explore has no training split, so every pose stands in. */
export function referenceFor(world: World): Record<ChannelName, ChannelReference> {
  const cached = references.get(world);
  if (cached != null) return cached;
  const sample = everyPoseSample(world, DEFAULT_SENSE_SETTINGS);
  const all = Int32Array.from({ length: sample.rows }, (_, i) => i);
  const reference = Object.fromEntries(CHANNELS.map((c) => {
    const values = sample.channels[c];
    return [c, channelReference(values, values.length / sample.rows, all, c)];
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
