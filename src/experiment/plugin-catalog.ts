import { resolve } from 'node:path';
import type { PolicyDefinition } from '../collect/policies.js';
import { bundlePlugin, evaluatePlugin, PluginLoadError, type PluginBundle } from './plugin-bundle.js';
import { definitionProblem, type PluginType } from './plugin-shapes.js';

/** A plug-in as a cell refers to it: plain data, sent to workers and stored in cell.json. */
export interface PluginRef {
  readonly type: PluginType;
  /** The name its default export gives; what results show. */
  readonly name: string;
  /** Absolute path of the plug-in file. */
  readonly path: string;
  /** SHA-256 of the file and every file it imports (PluginBundle.sha256). */
  readonly sha256: string;
}

/** A plug-in loaded in this process: its bundle and its checked, guarded default export. */
export interface LoadedPlugin extends PluginRef {
  readonly code: string;
  readonly definition: unknown;
}

/** An error thrown inside a plug-in's code, with the plug-in file named in front. */
export class PluginRunError extends Error {}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (value == null || typeof value !== 'object') return false;
  const prototype = Object.getPrototypeOf(value) as unknown;
  return prototype === Object.prototype || prototype === null;
}

/**
 * A copy of a plug-in's export whose functions, and the functions of plain objects they
 * return (an objective's signal), rethrow any error as a PluginRunError naming the file.
 * Tensors and arrays pass through untouched.
 */
export function guardPlugin<T>(value: T, label: string): T {
  if (typeof value === 'function') {
    const fn = value as (this: unknown, ...args: unknown[]) => unknown;
    return function guarded(this: unknown, ...args: unknown[]) {
      let result: unknown;
      try {
        result = fn.apply(this, args);
      } catch (error) {
        if (error instanceof PluginRunError) throw error;
        throw new PluginRunError(`${label}: ${error instanceof Error ? error.message : String(error)}`);
      }
      return guardPlugin(result, label);
    } as T;
  }
  if (!isPlainObject(value)) return value;
  return Object.fromEntries(Object.entries(value).map(([key, member]) => [key, typeof member === 'function' || isPlainObject(member) ? guardPlugin(member, label) : member])) as T;
}

/** Runs a bundle and checks its default export for `type`; throws PluginLoadError naming what is wrong. */
export function loadPlugin(bundle: Pick<PluginBundle, 'code' | 'path' | 'sha256'>, type: PluginType, filename = bundle.path): LoadedPlugin {
  const exported = evaluatePlugin(bundle.code, filename);
  let problem: string | null;
  try {
    problem = definitionProblem(exported, type);
  } catch (error) {
    problem = `checking its default export threw: ${error instanceof Error ? error.message : String(error)}`;
  }
  if (problem != null) throw new PluginLoadError(problem);
  const name = (exported as { name: string }).name;
  return { type, name, path: bundle.path, sha256: bundle.sha256, code: bundle.code, definition: guardPlugin(exported, `${type} plug-in ${bundle.path}`) };
}

/**
 * The plug-ins one config names, each bundled and loaded once (configs are checked once per
 * vary value and combination). Paths are relative to the config's folder.
 */
export class PluginCatalog {
  private readonly bundles = new Map<string, PluginBundle | PluginLoadError>();
  private readonly loaded = new Map<string, LoadedPlugin | PluginLoadError>();
  private readonly byName = new Map<string, string>();

  constructor(private readonly configDir: string) {}

  /** The plug-in a config value names as a part of `type`, or the one-line reason it cannot be used. */
  resolve(type: PluginType, value: string): LoadedPlugin | { readonly problem: string } {
    const path = resolve(this.configDir, value);
    const key = `${type}\0${path}`;
    let plugin = this.loaded.get(key);
    if (plugin == null) {
      try {
        plugin = loadPlugin(this.bundle(path), type);
      } catch (error) {
        if (!(error instanceof PluginLoadError)) throw error;
        plugin = error;
      }
      this.loaded.set(key, plugin);
    }
    if (plugin instanceof PluginLoadError) return { problem: `${value}: ${plugin.message}` };
    const other = this.byName.get(`${type}\0${plugin.name}`);
    if (other != null && other !== path) return { problem: `${value}: its name '${plugin.name}' is also the name of ${other}; plug-ins of one kind need distinct names` };
    this.byName.set(`${type}\0${plugin.name}`, path);
    return plugin;
  }

  /** Every plug-in that loaded, in the order first named. */
  get plugins(): LoadedPlugin[] {
    return [...this.loaded.values()].filter((p): p is LoadedPlugin => !(p instanceof PluginLoadError));
  }

  private bundle(path: string): PluginBundle {
    let bundle = this.bundles.get(path);
    if (bundle == null) {
      try {
        bundle = bundlePlugin(path);
      } catch (error) {
        if (!(error instanceof PluginLoadError)) throw error;
        bundle = error;
      }
      this.bundles.set(path, bundle);
    }
    if (bundle instanceof PluginLoadError) throw bundle;
    return bundle;
  }
}

/** A sweep's policy by name: the plug-in's definition when a loaded plug-in has that name, else the (built-in) name itself. */
export function sweepPolicy(plugins: readonly LoadedPlugin[], name: string): string | PolicyDefinition {
  const plugin = plugins.find((p) => p.type === 'policy' && p.name === name);
  return plugin == null ? name : (plugin.definition as PolicyDefinition);
}
