import { POLICY_NAMES } from '../collect/policies.js';
import { OBJECTIVES, RULES } from '../learn/spec.js';
import { MAX_SEVERITY } from '../noise/severity.js';
import { NOISE_KINDS } from '../noise/spec.js';
import { CHANNELS } from '../senses/channel.js';

/** The parts a config may take from a plug-in file, by the `type` its default export declares. */
export const PLUGIN_TYPES = ['objective', 'rule', 'policy', 'noise'] as const;
export type PluginType = (typeof PLUGIN_TYPES)[number];

/** What each type is called in messages, and the built-in names a plug-in of that type may not take. */
export const PLUGIN_TYPE_INFO: Readonly<Record<PluginType, { readonly label: string; readonly builtIns: readonly string[] }>> = {
  objective: { label: 'an objective', builtIns: OBJECTIVES },
  rule: { label: 'a learning rule', builtIns: RULES },
  policy: { label: 'a behaviour policy', builtIns: POLICY_NAMES },
  noise: { label: 'a noise kind', builtIns: NOISE_KINDS },
};

/** A member's expected kind: required unless marked optional. */
type Member = 'string' | 'function' | 'number' | 'optional function' | 'optional number' | 'optional list of channels' | 'target use' | 'severity list';

/** The members each type's default export has (the interfaces in learn/, collect/ and noise/). */
const MEMBERS: Readonly<Record<PluginType, Readonly<Record<string, Member>>>> = {
  objective: { name: 'string', description: 'string', target: 'target use', minBatch: 'optional number', setup: 'function' },
  rule: { name: 'string', description: 'string', init: 'optional function', deltas: 'function', update: 'optional function' },
  policy: { name: 'string', description: 'string', act: 'function' },
  noise: {
    name: 'string', description: 'string', channels: 'optional list of channels', clean: 'number',
    severities: 'severity list', parameter: 'string', valid: 'function', corrupt: 'function',
  },
};

const NAME = /^[A-Za-z0-9][A-Za-z0-9._-]*$/;

function memberProblem(value: unknown, member: Member): string | null {
  const optional = member.startsWith('optional ');
  if (value === undefined) return optional ? null : 'is missing';
  switch (member.replace('optional ', '')) {
    case 'string': return typeof value === 'string' && value.length > 0 ? null : 'must be a non-empty string';
    case 'function': return typeof value === 'function' ? null : 'must be a function';
    case 'number': return typeof value === 'number' && !Number.isNaN(value) ? null : 'must be a number';
    case 'list of channels':
      return Array.isArray(value) && value.length > 0 && value.every((c) => (CHANNELS as readonly unknown[]).includes(c)) ? null : `must list channels from ${CHANNELS.join(', ')}`;
    case 'target use': return ['required', 'optional', 'unused'].includes(value as string) ? null : "must be 'required', 'optional' or 'unused'";
    case 'severity list':
      return Array.isArray(value) && value.length === MAX_SEVERITY && value.every((p) => typeof p === 'number' && !Number.isNaN(p)) ? null : `must list the parameter at severities 1 to ${MAX_SEVERITY} (${MAX_SEVERITY} numbers)`;
    default: return null;
  }
}

/**
 * What is wrong with a plug-in's default export for the part it is named as, or null when it
 * has the shape of that type: a `type` tag, the members of the interface, a name that is
 * not a built-in's. A noise kind's own severities and clean value must pass its `valid`.
 */
export function definitionProblem(exported: unknown, type: PluginType): string | null {
  const example = `export default { type: '${type}', name: '...', ... } (crosswise new ${type} NAME writes a starter)`;
  if (exported == null || typeof exported !== 'object') return `expected a default export: ${example}`;
  const value = exported as Record<string, unknown>;
  if (value.type !== type) {
    const declared = (PLUGIN_TYPES as readonly unknown[]).includes(value.type) ? `it is ${PLUGIN_TYPE_INFO[value.type as PluginType].label} (type: '${String(value.type)}')` : `its type is ${JSON.stringify(value.type) ?? 'missing'}`;
    return `expected ${PLUGIN_TYPE_INFO[type].label} (type: '${type}'), but ${declared}`;
  }
  for (const [key, member] of Object.entries(MEMBERS[type])) {
    const problem = memberProblem(value[key], member);
    if (problem != null) return `its default export's ${key} ${problem}`;
  }
  const name = value.name as string;
  if (!NAME.test(name)) return `its name '${name}' must be letters, digits, '.', '_' or '-'`;
  if (PLUGIN_TYPE_INFO[type].builtIns.includes(name)) return `its name '${name}' is a built-in ${type}'s; give the plug-in another name`;
  if (type === 'noise') {
    const valid = value.valid as (p: number) => unknown;
    const bad = (value.severities as number[]).find((p) => valid(p) !== true);
    if (bad !== undefined) return `its own severity parameter ${bad} fails its valid()`;
  }
  return null;
}
