import { defineCommand } from './usage.js';

/** The kinds of part `crosswise new` writes a starter for (the `type` of a plug-in's default export). */
export const STARTER_KINDS = ['objective', 'rule', 'policy', 'noise'] as const;
export type StarterKind = (typeof STARTER_KINDS)[number];

/** What `crosswise new` takes and does. */
export const newUsage = defineCommand({
  name: 'new',
  summary: 'write a starter plug-in file and a config that runs it',
  details: 'Writes <name>.ts (a commented objective, rule, policy or noise plug-in that runs as it is) and <name>.yaml (a small sweep running it beside built-ins) into the folder. Refuses to overwrite either file.',
  operands: [
    { name: 'kind', description: STARTER_KINDS.join(' | ') },
    { name: 'name', description: "the plug-in's name: letters, digits, '.', '_' or '-', not a built-in's" },
  ],
  options: {
    dir: { kind: 'text', value: 'DIR', default: '.', description: 'the folder to write both files into' },
  },
  examples: ['crosswise new objective l1-predict', 'crosswise new rule my-rule --dir experiments'],
  exitCodes: [0, 1, 5],
  load: async () => (await import('./new.js')).newCommand,
});
