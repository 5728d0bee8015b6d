import { describe, expect, it } from 'vitest';
import { constantLatents } from '../../src/collect/constant-latents.js';
import { DEFAULT_SENSE_SETTINGS } from '../../src/senses/channel.js';
import { tinyWorld } from '../world/fixtures.js';

describe('latents that cannot vary in a world', () => {
  it('finds nearest_emitter constant with one emitter, and material_under with one floor material', () => {
    // One bell, floor everywhere the agent can stand (the bell is solid).
    const constant = constantLatents(tinyWorld(['#####', '#...#', '#..E#', '#####']), DEFAULT_SENSE_SETTINGS);
    expect([...constant.entries()]).toEqual([['material_under', 1], ['nearest_emitter', 0]]);
  });

  it('finds nothing constant once a second emitter and a second floor material are in reach', () => {
    // A rug cell under the agent's feet and a gong: every pose-dependent latent now takes two values.
    const constant = constantLatents(tinyWorld(['######', '#F.,.#', '#...E#', '######']), DEFAULT_SENSE_SETTINGS);
    expect([...constant.keys()]).toEqual([]);
  });
});
