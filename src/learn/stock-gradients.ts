import { existsSync, readFileSync } from 'node:fs';
import vm from 'node:vm';
import * as tf from '@tensorflow/tfjs-core';

/**
 * Registers tfjs-core's own gradient functions, which its Node entry leaves out.
 *
 * Why a bundle rather than the umbrella `@tensorflow/tfjs` package: the umbrella is not a
 * dependency and would pull in layers, converter and data just to run one registration
 * module; that module (`dist/register_all_gradients.js`) cannot be imported by Node
 * directly because its ESM imports have no file extensions. The package build
 * (scripts/build.js, run by `npm install`) bundles it from the installed tfjs-core into
 * dist/vendor/, named after that version, so it cannot drift from the library it
 * registers into. Running it registers into the same engine because tfjs-core keeps its
 * engine and registries on `globalThis` and recognises tensors from another copy of
 * itself by their shape (`Symbol.hasInstance`).
 */
export function registerStockGradients(): void {
  const name = `tfjs-core-${tf.version_core}-register-all-gradients.js`;
  // src/learn/ and dist/learn/ both sit two folders below the package root.
  const bundle = new URL(`../../dist/vendor/${name}`, import.meta.url);
  if (!existsSync(bundle)) {
    throw new Error(`the gradient bundle dist/vendor/${name} is missing: run \`npm run build\` (npm install runs it)`);
  }
  vm.runInThisContext(readFileSync(bundle, 'utf8'), { filename: name });
}
