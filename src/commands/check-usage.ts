import { defineCommand } from './usage.js';

/** What `crosswise check` takes and does. */
export const checkUsage = defineCommand({
  name: 'check',
  summary: 'validate config and world files',
  details: "Prints every problem as file:line:col and a reason, or one ok line per valid file. A config's plug-in files are bundled and loaded, and their problems are reported at the key that names them. Nothing is written.",
  operands: [{ name: 'file', repeats: true, description: 'config or world files (YAML)' }],
  options: {},
  examples: ['crosswise check configs/*.yaml worlds/*.yaml'],
  exitCodes: [0, 1],
  load: async () => (await import('./check.js')).checkCommand,
});
