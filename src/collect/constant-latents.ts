import { sceneFor } from '../senses/scene.js';
import type { SenseSettings } from '../senses/channel.js';
import { step } from '../world/movement.js';
import { HEADINGS, type World } from '../world/types.js';
import { LATENT_NAMES, type LatentName } from './dataset.js';
import { latentRow } from './latents.js';

/**
 * The latents that take one value at every pose the agent can be in (every free cell, every
 * heading, after every action), with that value: a probe has nothing to read out of them in
 * this world with these senses (one emitter makes nearest_emitter constant, one floor
 * material makes material_under constant). Episodes start on any free cell, so every free
 * pose can occur whatever the policy.
 */
export function constantLatents(world: World, settings: SenseSettings): ReadonlyMap<LatentName, number> {
  const scene = sceneFor(world, settings);
  const row = new Float64Array(LATENT_NAMES.length);
  const first = new Float64Array(LATENT_NAMES.length).fill(NaN);
  const varies = new Array<boolean>(LATENT_NAMES.length).fill(false);
  for (let cell = 0; cell < world.width * world.height; cell++) {
    if (world.solid[cell] === 1) continue;
    for (const heading of HEADINGS) {
      const pose = { x: cell % world.width, y: Math.floor(cell / world.width), heading };
      // Stay (nothing moves), forward and back (moves and bumps) from this pose; turns add nothing new.
      for (const action of ['stay', 'forward', 'back'] as const) {
        const transition = step(world, pose, action);
        latentRow(scene, transition.pose, transition, row);
        for (let i = 0; i < row.length; i++) {
          if (Number.isNaN(first[i])) first[i] = row[i];
          else if (row[i] !== first[i]) varies[i] = true;
        }
      }
    }
  }
  return new Map(LATENT_NAMES.flatMap((name, i) => (varies[i] ? [] : [[name, first[i]] as const])));
}
