/** The world: file loading and validation, movement, emitter timing, grid lines. */
export { checkWorldFile, checkWorldText, loadWorld, parseWorld, WORLD_DEFAULTS } from './parse.js';
export { WorldFileError } from './problems.js';
export { cellAhead, headingVector, isBlocked, step } from './movement.js';
export { emitterIsOn } from './emitter.js';
export { arrivalTransition } from './arrival.js';
export { forEachCellBetween, solidCellsBetween } from './line.js';
export * from './types.js';
