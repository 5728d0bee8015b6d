import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { POLICY_NAMES } from '../collect/policies.js';
import { OBJECTIVES, RULES } from '../learn/spec.js';
import { NOISE_KINDS } from '../noise/spec.js';
import { suggestion } from '../experiment/config-errors.js';
import { runAction } from './command-line.js';
import { EXIT } from './exit-codes.js';
import { newUsage, STARTER_KINDS, type StarterKind } from './new-usage.js';
import { starterFiles } from './plugin-starters.js';
import { UsageError } from './usage.js';

/** The package's demo world and config schema (src/ and dist/ both sit one folder below the package). */
const WORLD = fileURLToPath(new URL('../../worlds/greenhouse.yaml', import.meta.url));
const SCHEMA = fileURLToPath(new URL('../../configs/crosswise.schema.json', import.meta.url));

const BUILT_IN: Readonly<Record<StarterKind, readonly string[]>> = { objective: OBJECTIVES, rule: RULES, policy: POLICY_NAMES, noise: NOISE_KINDS };
const LABEL: Readonly<Record<StarterKind, string>> = { objective: 'an objective', rule: 'a learning-rule', policy: 'a behaviour-policy', noise: 'a noise-kind' };

function checkName(kind: StarterKind, name: string): void {
  if (!/^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(name)) throw new UsageError(`<name>: expected letters, digits, '.', '_' or '-' (starting with a letter or digit), got '${name}'`);
  if (BUILT_IN[kind].includes(name)) throw new UsageError(`<name>: '${name}' is a built-in ${kind}; give the plug-in another name`);
}

/** A path from `from` to `to` that reads as relative (YAML and editors resolve it from the config's folder). */
function fromFolder(from: string, to: string): string {
  const path = relative(from, to);
  return path.startsWith('.') ? path : `./${path}`;
}

/** `crosswise new`: writes a starter plug-in and a config that uses it (see new-usage.ts). */
export async function newCommand(args: readonly string[]): Promise<number> {
  return runAction(newUsage, args, async ({ operands: [kind, name], values }) => {
    if (!(STARTER_KINDS as readonly string[]).includes(kind)) {
      throw new UsageError(`<kind>: expected one of ${STARTER_KINDS.join(' | ')}, got '${kind}'${suggestion(kind, STARTER_KINDS)}`);
    }
    checkName(kind as StarterKind, name);
    const dir = resolve(values.dir);
    const pluginPath = join(dir, `${name}.ts`);
    const configPath = join(dir, `${name}.yaml`);
    for (const path of [pluginPath, configPath]) {
      if (existsSync(path)) throw new UsageError(`${path} already exists; choose another name or move it away (nothing was written)`);
    }
    const files = starterFiles(kind as StarterKind, name, { world: fromFolder(dir, WORLD), schema: fromFolder(dir, SCHEMA) });
    mkdirSync(dir, { recursive: true });
    writeFileSync(pluginPath, files.plugin, { flag: 'wx' });
    writeFileSync(configPath, files.config, { flag: 'wx' });
    const shown = (path: string) => (relative(process.cwd(), path).startsWith('..') ? path : relative(process.cwd(), path));
    console.log(`wrote ${shown(pluginPath)} (${LABEL[kind as StarterKind]} plug-in that runs as it is) and ${shown(configPath)} (a sweep using it)`);
    console.log(`next: crosswise check ${shown(configPath)}, then crosswise run ${shown(configPath)}`);
    return EXIT.success;
  });
}
