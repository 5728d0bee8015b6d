import { basename } from 'node:path';
import { latentClassNames } from '../collect/collector.js';
import { constantLatents } from '../collect/constant-latents.js';
import type { LatentName } from '../collect/dataset.js';
import type { World } from '../world/types.js';
import type { ConfigProblem } from './config-errors.js';
import type { ResolvedSettings } from './resolved-config.js';

/** Why a latent with this constant value cannot vary, in words. */
function describe(name: LatentName, value: number, world: World): string {
  const label = latentClassNames(world)[name]?.[value];
  const always = `it is always ${label == null ? value : `'${label}'`}`;
  if (name === 'nearest_emitter' && world.emitters.length === 1) return `${always} (the world has one emitter)`;
  if (name === 'material_under') return `${always} (every free cell is ${label})`;
  return always;
}

/**
 * A warning for each probe target that takes one value at every pose of a combination's
 * world (see constantLatents): its scores would say nothing. Not an error: the config is
 * valid, and a researcher may mean it (a control, or one world of a vary list).
 */
export function constantTargetWarnings(
  combinations: readonly { readonly settings: ResolvedSettings }[], worlds: ReadonlyMap<string, World>,
): ConfigProblem[] {
  const seen = new Set<string>();
  const cache = new Map<string, ReadonlyMap<LatentName, number>>();
  return combinations.flatMap(({ settings }) => {
    const world = worlds.get(settings.worldPath);
    if (world == null) return [];
    const key = `${settings.worldPath}\n${JSON.stringify(settings.senses)}`;
    if (!cache.has(key)) cache.set(key, constantLatents(world, settings.senses));
    const constant = cache.get(key) as ReadonlyMap<LatentName, number>;
    return settings.probe.targets.flatMap((target, i): ConfigProblem[] => {
      const value = constant.get(target);
      if (value == null) return [];
      const message = `${target} cannot vary in world '${world.name}' (${basename(settings.worldPath)}): `
        + `${describe(target, value, world)}, so a probe has nothing to read out`;
      if (seen.has(message)) return [];
      seen.add(message);
      return [{ path: ['probe', 'targets', i], message, warning: true }];
    });
  });
}
