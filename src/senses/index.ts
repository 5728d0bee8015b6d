/** The four senses: channel registry, per-channel sensing and the precomputed scene. */
export * from './channel.js';
export { CHANNEL_UNITS, channelEntryNames, channelShape, channelSize } from './registry.js';
export { bandCentresHz, hzToMel, melToHz } from './mel.js';
export { dbToPower, distanceLossDb, ildDb, MIN_DISTANCE_M, spectrumShapeDb, THUD } from './acoustics.js';
export { createScene, sceneFor, type SensoryScene } from './scene.js';
export { senseAll, senseInto, type ChannelRows } from './sense-all.js';
export { TOUCH_NAMES } from './touch.js';
export { viewFrom, visibleCell } from './sight.js';
