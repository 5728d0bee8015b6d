import type { SenseSettings } from './channel.js';

/** Mel pitch of a frequency: m = 2595 · log10(1 + f / 700) (O'Shaughnessy 1987, Speech Communication). */
export function hzToMel(hz: number): number {
  return 2595 * Math.log10(1 + hz / 700);
}

/** Inverse of hzToMel. */
export function melToHz(mel: number): number {
  return 700 * (10 ** (mel / 2595) - 1);
}

/**
 * Centre frequencies of the sound bands in Hz, equally spaced on the mel scale from
 * `minHz` (first band) to `maxHz` (last band) inclusive.
 */
export function bandCentresHz(settings: SenseSettings): Float64Array {
  const { bands, minHz, maxHz } = settings.sound;
  const low = hzToMel(minHz);
  const high = hzToMel(maxHz);
  const centres = new Float64Array(bands);
  for (let b = 0; b < bands; b++) centres[b] = melToHz(bands === 1 ? low : low + ((high - low) * b) / (bands - 1));
  return centres;
}
