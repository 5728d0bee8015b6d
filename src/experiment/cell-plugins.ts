import { existsSync, readFileSync } from 'node:fs';
import type { PolicyDefinition } from '../collect/policies.js';
import type { ObjectiveDefinition } from '../learn/objective-definition.js';
import type { RuleDefinition } from '../learn/rule-definition.js';
import type { NoiseKindDefinition } from '../noise/kind-definition.js';
import { loadPlugin, PluginRunError } from './plugin-catalog.js';
import type { PlannedPlugin } from './plan.js';
import type { PluginType } from './plugin-shapes.js';

/** The parts of one cell that come from plug-ins, ready to pass to collect, train and probe. */
export interface CellParts {
  readonly objective?: ObjectiveDefinition;
  readonly rule?: RuleDefinition;
  readonly policy?: PolicyDefinition;
  /** Noise kinds by name. */
  readonly noise: Readonly<Record<string, NoiseKindDefinition>>;
}

/**
 * Loads a cell's plug-ins from the scripts bundled when the sweep was prepared: plain
 * JavaScript, so a worker thread or a cluster task needs no TypeScript loader. Each cell
 * loads them afresh, so state a plug-in keeps in its module never passes from one cell to
 * the next (results do not depend on which cells share a worker).
 */
export function loadCellParts(plugins: readonly PlannedPlugin[]): CellParts {
  const loaded = plugins.map((plugin) => {
    if (!existsSync(plugin.bundle)) throw new Error(`the bundled script of ${plugin.type} plug-in ${plugin.path} is missing (${plugin.bundle}); run the sweep again to rewrite it`);
    return { type: plugin.type, definition: loadPlugin({ code: readFileSync(plugin.bundle, 'utf8'), path: plugin.path, sha256: plugin.sha256 }, plugin.type).definition };
  });
  const of = <T>(type: PluginType): T | undefined => loaded.find((p) => p.type === type)?.definition as T | undefined;
  const noise = loaded.filter((p) => p.type === 'noise').map((p) => p.definition as NoiseKindDefinition);
  return {
    objective: of<ObjectiveDefinition>('objective'),
    rule: of<RuleDefinition>('rule'),
    policy: of<PolicyDefinition>('policy'),
    noise: Object.fromEntries(noise.map((kind) => [kind.name, kind])),
  };
}

/**
 * Runs one phase of a cell that may call into plug-ins of the given types. An error thrown
 * inside plug-in code already names its file; any other failure (a non-finite loss, an answer
 * of the wrong shape) gets the phase's plug-in files appended, so the reason points at them.
 */
export async function namingPlugins<T>(plugins: readonly PlannedPlugin[], types: readonly PluginType[], phase: () => Promise<T> | T): Promise<T> {
  try {
    return await phase();
  } catch (error) {
    const involved = plugins.filter((p) => types.includes(p.type));
    if (involved.length === 0 || !(error instanceof Error) || error instanceof PluginRunError) throw error;
    const named = new Error(`${error.message} (${involved.map((p) => `${p.type} plug-in ${p.path}`).join(', ')})`);
    named.name = error.name;
    throw named;
  }
}
