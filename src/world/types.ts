/** The four compass headings; north is up (y decreasing). */
export const HEADINGS = ['north', 'east', 'south', 'west'] as const;
export type Heading = (typeof HEADINGS)[number];

/** The agent's five actions, in motor-channel order. */
export const ACTIONS = ['forward', 'back', 'turn-left', 'turn-right', 'stay'] as const;
export type Action = (typeof ACTIONS)[number];

/** Red, green, blue reflectance, each in 0..1. */
export type Colour = readonly [number, number, number];

/** A band-limited sound: centre frequency, width in octaves, level in dB at 1 m. */
export interface SoundBand {
  readonly centreHz: number;
  readonly bandwidthOctaves: number;
  readonly levelDb: number;
}

/** Entries in every material's touch texture vector (fixed so touch has one size in every world). */
export const TEXTURE_SIZE = 4;

/** One kind of floor or wall. */
export interface Material {
  readonly name: string;
  readonly glyph: string;
  readonly solid: boolean;
  readonly colour: Colour;
  /** Footfall vibration spectrum felt through the feet, each entry in 0..1. */
  readonly texture: readonly number[];
  /** The sound of a footstep on this material; absent for silent or solid materials. */
  readonly footstep?: SoundBand;
}

/** One sound source placed on the map. */
export interface Emitter extends SoundBand {
  readonly name: string;
  readonly glyph: string;
  /** Index into World.materials of the floor under the emitter. */
  readonly onMaterial: number;
  readonly solid: boolean;
  readonly colour: Colour;
  /** 0 means always on; otherwise the on/off cycle length in steps. */
  readonly periodSteps: number;
  /** Fraction of each period the emitter is on, 0..1. */
  readonly duty: number;
  readonly x: number;
  readonly y: number;
}

/** Where the agent stands and which way it faces. */
export interface Pose {
  readonly x: number;
  readonly y: number;
  readonly heading: Heading;
}

/** A validated world. Cell arrays are row-major: index = y * width + x. */
export interface World {
  readonly name: string;
  readonly description: string;
  readonly cellSizeM: number;
  readonly ambientDb: number;
  readonly wallLossDb: number;
  readonly materials: readonly Material[];
  readonly emitters: readonly Emitter[];
  readonly width: number;
  readonly height: number;
  /** Material index of each cell (for an emitter cell, the material it stands on). */
  readonly material: Uint8Array;
  /** 1 where the agent cannot enter and sound pays the wall loss. */
  readonly solid: Uint8Array;
  /** Emitter index at each cell, or -1. */
  readonly emitterAt: Int16Array;
  readonly start?: Pose;
}

/** The result of one action. */
export interface Transition {
  readonly pose: Pose;
  readonly moved: boolean;
  readonly bumped: boolean;
}
