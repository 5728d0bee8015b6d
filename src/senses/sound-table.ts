import { solidCellsBetween } from '../world/line.js';
import type { World } from '../world/types.js';
import { distanceLossDb, ildDb } from './acoustics.js';

/** Table kinds per emitter: the near ear, the far ear when facing north/south, the far ear when facing east/west. */
export const NEAR = 0;
export const FAR_NORTH_SOUTH = 1;
export const FAR_EAST_WEST = 2;

/**
 * The far ear's power gain 10^(−ILD/10) per band for a source at offset (dx, dy) cells, facing
 * north/south (row 0) or east/west (row 1), [2, bands]. It depends only on |dx| and |dy|, so
 * each offset met is worked out once per world and shared by every cell and emitter.
 */
export class FarEarGains {
  readonly bands: number;
  private readonly shadow90: Float64Array; // [bands] the far ear's ILD for a source at the side, dB
  private readonly byOffset = new Map<number, Float64Array>();

  constructor(bandsHz: Float64Array, private readonly height: number) {
    this.bands = bandsHz.length;
    this.shadow90 = bandsHz.map((hz) => ildDb(hz, 90));
  }

  /** The gains [2, bands] for a source at (dx, dy) cells from the listener. */
  at(dx: number, dy: number): Float64Array {
    const key = Math.abs(dx) * this.height + Math.abs(dy);
    let gains = this.byOffset.get(key);
    if (gains == null) {
      const bands = this.bands;
      const cells = Math.hypot(dx, dy);
      // |sin(azimuth)|: the lateral share of the offset, x when facing north/south, y when facing east/west.
      const sinNorthSouth = cells === 0 ? 0 : Math.abs(dx) / cells;
      const sinEastWest = cells === 0 ? 0 : Math.abs(dy) / cells;
      gains = new Float64Array(2 * bands);
      for (let b = 0; b < bands; b++) {
        gains[b] = 10 ** ((-this.shadow90[b] * sinNorthSouth) / 10);
        gains[bands + b] = 10 ** ((-this.shadow90[b] * sinEastWest) / 10);
      }
      this.byOffset.set(key, gains);
    }
    return gains;
  }
}

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
  emitterPower1m: Float64Array, // [emitters, bands] each emitter's band powers at 1 m
  farEar: FarEarGains,
  cell: number,
): Float32Array {
  const bands = farEar.bands;
  const x = cell % world.width;
  const y = Math.floor(cell / world.width);
  const table = new Float32Array(world.emitters.length * 3 * bands);
  world.emitters.forEach((e, i) => {
    const dx = e.x - x;
    const dy = e.y - y;
    const walls = solidCellsBetween(world.solid, world.width, x, y, e.x, e.y);
    const pathGain = 10 ** ((distanceLossDb(Math.hypot(dx, dy) * world.cellSizeM) - walls * world.wallLossDb) / 10);
    const far = farEar.at(dx, dy);
    for (let b = 0; b < bands; b++) {
      const near = emitterPower1m[i * bands + b] * pathGain;
      const at = i * 3 * bands + b;
      table[at + NEAR * bands] = near;
      table[at + FAR_NORTH_SOUTH * bands] = near * far[b];
      table[at + FAR_EAST_WEST * bands] = near * far[bands + b];
    }
  });
  return table;
}
