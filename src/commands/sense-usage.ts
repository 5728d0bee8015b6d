import { ACTIONS } from '../world/types.js';
import { defineCommand } from './usage.js';

/** What `crosswise sense` takes and does. */
export const senseUsage = defineCommand({
  name: 'sense',
  summary: 'every channel and latent at one pose of a world',
  details: "Values are in physical units (listed per channel), with the default sense settings or a config's.",
  operands: [{ name: 'world', orOption: ['config'], description: 'a world file (YAML)' }],
  options: {
    config: { kind: 'text', value: 'FILE', description: 'a sweep config, for its world and sense settings' },
    at: { kind: 'text', value: 'X,Y,HEADING', required: true, description: "the agent's cell (from 0, x to the right, y down) and heading, e.g. 2,3,north" },
    action: { kind: 'choice', choices: ACTIONS, value: 'A', default: 'stay', description: 'the action that brought the agent there; touch, motor and footsteps depend on it' },
    step: { kind: 'integer', value: 'N', min: 0, default: 0, description: "the step number, which sets the emitters' on/off phase" },
    json: { kind: 'flag', description: 'one JSON object instead of tables' },
  },
  examples: [
    'crosswise sense worlds/greenhouse.yaml --at 2,2,east --action forward --json',
    'crosswise sense --config configs/quickstart.yaml --at 2,2,east',
  ],
  exitCodes: [0, 1],
  load: async () => (await import('./sense.js')).senseCommand,
});
