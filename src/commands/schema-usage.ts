import { defineCommand } from './usage.js';

/** What `crosswise schema` takes and does. */
export const schemaUsage = defineCommand({
  name: 'schema',
  summary: 'print the config JSON Schema, for editors',
  operands: [],
  options: {},
  examples: ['crosswise schema > crosswise.schema.json'],
  exitCodes: [0, 1],
  load: async () => (await import('./schema.js')).schemaCommand,
});
