import { solidCellsBetween } from '../world/line.js';
import type { World } from '../world/types.js';
import { distanceLossDb, ildDb } from './acoustics.js';

/** Table kinds per emitter: the near ear, the far ear when facing north/south, the far ear when facing east/west. */
export const NEAR = 0;
export const FAR_NORTH_SOUTH = 1;
export const FAR_EAST_WEST = 2;

/**
 * Band powers of every emitter heard at one cell, laid out [emitters, 3, bands]:
 * kind NEAR is the level at the ear facing the source, the FAR kinds the shadowed ear.
 *
 * Facing north or south the source's lateral offset is its x offset, facing east or west its
 * y offset, so |sin(azimuth)| and hence the far-ear shadow take only two values per cell;
 * which ear is near depends on the heading and is chosen when sensing.
 * Level = source level at 1 m + spectrum shape + inverse-square loss over the straight
 * distance between cell centres − wall_loss_db per solid cell strictly between the two
 * (on the Bresenham line drawn from the listener).
 */
export function soundCellTable(
  world: World,
  bandsHz: Float64Array, // [bands]
  emitterPower1m: Float64Array, // [emitters, bands] each emitter's band powers at 1 m
  cell: number,
): Float32Array {
  const bands = bandsHz.length;
  const x = cell % world.width;
  const y = Math.floor(cell / world.width);
  const table = new Float32Array(world.emitters.length * 3 * bands);
  world.emitters.forEach((e, i) => {
    const dx = e.x - x;
    const dy = e.y - y;
    const cells = Math.hypot(dx, dy);
    const walls = solidCellsBetween(world.solid, world.width, x, y, e.x, e.y);
    const pathGain = 10 ** ((distanceLossDb(cells * world.cellSizeM) - walls * world.wallLossDb) / 10);
    const sinNorthSouth = cells === 0 ? 0 : Math.abs(dx) / cells;
    const sinEastWest = cells === 0 ? 0 : Math.abs(dy) / cells;
    for (let b = 0; b < bands; b++) {
      const near = emitterPower1m[i * bands + b] * pathGain;
      const shadow90 = ildDb(bandsHz[b], 90);
      const at = i * 3 * bands + b;
      table[at + NEAR * bands] = near;
      table[at + FAR_NORTH_SOUTH * bands] = near * 10 ** ((-shadow90 * sinNorthSouth) / 10);
      table[at + FAR_EAST_WEST * bands] = near * 10 ** ((-shadow90 * sinEastWest) / 10);
    }
  });
  return table;
}
