/** The four sensory channels, in a fixed order used everywhere. */
export const CHANNELS = ['sight', 'sound', 'touch', 'motor'] as const;
export type ChannelName = (typeof CHANNELS)[number];

/** Sense sizes a config may change; everything else about a sense is fixed physics. */
export interface SenseSettings {
  readonly sight: { readonly width: number; readonly depth: number };
  readonly sound: { readonly bands: number; readonly minHz: number; readonly maxHz: number };
}

/** The documented defaults: a 5×4 view, 16 mel bands from 100 Hz to 8 kHz. */
export const DEFAULT_SENSE_SETTINGS: SenseSettings = {
  sight: { width: 5, depth: 4 },
  sound: { bands: 16, minHz: 100, maxHz: 8000 },
};
