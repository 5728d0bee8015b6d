import { ACTIONS } from '../world/types.js';
import type { ChannelName, SenseSettings } from './channel.js';
import { bandCentresHz } from './mel.js';
import { TOUCH_NAMES } from './touch.js';

const RGB = ['r', 'g', 'b'] as const;

/** Number of numbers one step of a channel holds. */
export function channelSize(channel: ChannelName, settings: SenseSettings): number {
  switch (channel) {
    case 'sight': return settings.sight.depth * settings.sight.width * 3;
    case 'sound': return 2 * settings.sound.bands;
    case 'touch': return TOUCH_NAMES.length;
    case 'motor': return ACTIONS.length;
  }
}

/** Shape of one step of a channel, outermost first. */
export function channelShape(channel: ChannelName, settings: SenseSettings): readonly number[] {
  switch (channel) {
    case 'sight': return [settings.sight.depth, settings.sight.width, 3];
    case 'sound': return [2, settings.sound.bands];
    case 'touch': return [TOUCH_NAMES.length];
    case 'motor': return [ACTIONS.length];
  }
}

/** The physical unit of each channel's entries. */
export const CHANNEL_UNITS: Readonly<Record<ChannelName, string>> = {
  sight: 'colour reflectance × lamp illumination (0..1)',
  sound: 'dB re the world reference level, per band',
  touch: 'whisker contact 0/1, bump force in full-speed bumps, footfall vibration 0..1',
  motor: 'one-hot action',
};

/** A name for every entry of a channel, in flattened order (e.g. `d0_w2_g`, `left_1000hz`). */
export function channelEntryNames(channel: ChannelName, settings: SenseSettings): readonly string[] {
  switch (channel) {
    case 'sight': {
      const names: string[] = [];
      for (let d = 0; d < settings.sight.depth; d++) {
        for (let w = 0; w < settings.sight.width; w++) for (const c of RGB) names.push(`d${d}_w${w}_${c}`);
      }
      return names;
    }
    case 'sound': {
      const hz = [...bandCentresHz(settings)].map((f) => `${Math.round(f)}hz`);
      return [...hz.map((f) => `left_${f}`), ...hz.map((f) => `right_${f}`)];
    }
    case 'touch': return TOUCH_NAMES;
    case 'motor': return ACTIONS;
  }
}
