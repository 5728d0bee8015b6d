import { createHash } from 'node:crypto';
import { existsSync, readFileSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { runInThisContext } from 'node:vm';
import { buildSync, type BuildFailure, type Message } from 'esbuild';

/** File endings that name a plug-in file rather than a built-in part. */
export const PLUGIN_EXTENSIONS = ['.ts', '.mts', '.js', '.mjs', '.cjs'] as const;

/** Whether a config value names a plug-in file (a path ending in a script extension). */
export function isPluginPath(value: string): boolean {
  return PLUGIN_EXTENSIONS.some((extension) => value.endsWith(extension));
}

/** A plug-in file and everything it imports, bundled into one CommonJS script. */
export interface PluginBundle {
  /** Absolute path of the plug-in file. */
  readonly path: string;
  /** The bundled script: plain JavaScript that needs no TypeScript loader. */
  readonly code: string;
  /** SHA-256 of every bundled file's path (relative to the plug-in's folder) and content. */
  readonly sha256: string;
}

/** A plug-in that cannot be bundled or loaded; the message says why in one line. */
export class PluginLoadError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PluginLoadError';
  }
}

function firstMessage(messages: readonly Message[], folder: string): string {
  const m = messages[0];
  if (m == null) return 'unknown bundling error';
  const where = m.location == null ? '' : `${join(folder, m.location.file)}:${m.location.line}:${m.location.column + 1}: `;
  return `${where}${m.text}`;
}

/**
 * Bundles a plug-in with esbuild (already the package's build tool), so worker threads and
 * cluster tasks load one plain script: TypeScript is stripped, the files it imports are
 * inlined, Node's built-in modules stay `require`s. TensorFlow.js is never bundled: a
 * plug-in receives crosswise's own instance, and an import of it is an error.
 */
export function bundlePlugin(path: string): PluginBundle {
  if (!existsSync(path) || !statSync(path).isFile()) throw new PluginLoadError(`plug-in file not found: ${path}`);
  const folder = dirname(path);
  let result;
  try {
    result = buildSync({
      entryPoints: [path], absWorkingDir: folder, bundle: true, write: false, metafile: true,
      format: 'cjs', platform: 'node', target: 'node20', external: ['@tensorflow/*'], logLevel: 'silent',
    });
  } catch (error) {
    throw new PluginLoadError(`cannot bundle the plug-in: ${firstMessage((error as BuildFailure).errors ?? [], folder)}`);
  }
  const inputs = Object.entries(result.metafile.inputs).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  for (const [file, input] of inputs) {
    const tf = input.imports.find((i) => i.path.startsWith('@tensorflow/'));
    if (tf != null) throw new PluginLoadError(`${join(folder, file)} imports ${tf.path}: a plug-in uses the tf it is given (context.tf), never its own TensorFlow.js`);
  }
  const hash = createHash('sha256');
  for (const [file] of inputs) hash.update(`${file}\0${createHash('sha256').update(readFileSync(join(folder, file))).digest('hex')}\n`);
  return { path, code: result.outputFiles[0].text, sha256: hash.digest('hex') };
}

/**
 * Runs a bundled plug-in script and returns its default export (for a CommonJS file without
 * one, `module.exports` itself). `filename` names it in stack traces; `require` resolves
 * from the plug-in's own folder.
 */
export function evaluatePlugin(code: string, filename: string): unknown {
  const module = { exports: {} as Record<string, unknown> };
  const wrapper = runInThisContext(`(function (exports, require, module, __filename, __dirname) {${code}\n})`, { filename }) as (...args: unknown[]) => void;
  try {
    wrapper(module.exports, createRequire(filename), module, filename, dirname(filename));
  } catch (error) {
    throw new PluginLoadError(`loading the plug-in threw: ${error instanceof Error ? error.message : String(error)}`);
  }
  const exported = module.exports;
  return exported != null && typeof exported === 'object' && ('__esModule' in exported || 'default' in exported) ? exported.default : exported;
}
