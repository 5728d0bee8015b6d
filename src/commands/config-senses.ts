import { loadSweep } from '../experiment/config.js';
import type { SenseSettings } from '../senses/channel.js';

/**
 * The world file and sense settings a config uses (its first combination when `vary`
 * changes them); throws the loader's ConfigError when the config is invalid.
 */
export function configWorldAndSenses(configPath: string): { readonly worldPath: string; readonly senses: SenseSettings } {
  const { settings } = loadSweep(configPath).combinations[0];
  return { worldPath: settings.worldPath, senses: settings.senses };
}

/** What to do when a config is given where a world is expected. */
export const CONFIG_HINT = 'give a config with --config to use its world and senses';
