// The package's build (run by `npm install` through `prepare`, or `npm run build`):
// compiles src/ to dist/ file by file, so the CLI starts without a TypeScript loader,
// assembles the WebAssembly kernels, and bundles tfjs-core's gradient registrations, which
// Node cannot import from the package.
import { copyFileSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { createRequire } from 'node:module';
import { basename, dirname, join, relative } from 'node:path';
import { fileURLToPath, URL } from 'node:url';
import { build } from 'esbuild';
import { sourceStamp, STAMP_FILE } from './source-stamp.js';

const root = fileURLToPath(new URL('../', import.meta.url));
const require = createRequire(import.meta.url);
const src = join(root, 'src');
const dist = join(root, 'dist');

/** Every file under `dir`, as absolute paths. */
function filesUnder(dir) {
  return readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => join(entry.parentPath, entry.name));
}

// Taken before compiling: a source edited during the build makes the stamp disagree, so
// the bin runs the sources rather than a dist/ that may predate the edit.
const stamp = sourceStamp(root);
// Removed first and stamped last: a start that races the build finds no stamp and runs the sources.
rmSync(dist, { recursive: true, force: true });

const sources = filesUnder(src);
const typescript = sources.filter((file) => /\.tsx?$/.test(file) && !file.endsWith('.d.ts'));
// No bundling: each module keeps its place, so `new URL('./x.js', import.meta.url)` still finds
// its neighbour (worker entries, demo worlds, package.json) in dist/ as in src/.
await build({
  entryPoints: typescript, outdir: dist, outbase: src, format: 'esm', platform: 'node', target: 'node20',
  jsx: 'automatic', sourcemap: 'linked', logLevel: 'warning',
});
for (const file of sources.filter((f) => !/\.tsx?$/.test(f))) {
  const target = join(dist, relative(src, file));
  mkdirSync(dirname(target), { recursive: true });
  copyFileSync(file, target);
}

// tfjs-core's Node entry registers no gradients, and its dist/register_all_gradients.js has
// extension-less ESM imports that Node will not load: bundle it into one script, named after
// the tfjs-core version it was built from (src/learn/stock-gradients.ts checks the name).
const corePackage = require.resolve('@tensorflow/tfjs-core/package.json');
const { version } = JSON.parse(readFileSync(corePackage, 'utf8'));
await build({
  entryPoints: [join(dirname(corePackage), 'dist', 'register_all_gradients.js')],
  outfile: join(dist, 'vendor', `tfjs-core-${version}-register-all-gradients.js`),
  bundle: true, format: 'iife', platform: 'node', target: 'node20', logLevel: 'warning',
});

// WebAssembly kernels are written as text (src/**/*.wat) and assembled here, each to
// dist/wasm/<name>-<first 16 hex digits of its source's SHA-256>.wasm, so a module running
// from src/ after an edit finds no binary of an older text (src/learn/wasm-module.ts).
const wabt = await require('wabt')();
for (const file of sources.filter((f) => f.endsWith('.wat'))) {
  const text = readFileSync(file, 'utf8');
  let module;
  try {
    module = wabt.parseWat(relative(root, file), text, { simd: true });
    module.validate();
  } catch (error) {
    // Thrown anew so that Node prints this line, not a line of wabt's minified source.
    throw new Error(error.message);
  }
  try {
    const name = `${basename(file, '.wat')}-${createHash('sha256').update(text).digest('hex').slice(0, 16)}.wasm`;
    mkdirSync(join(dist, 'wasm'), { recursive: true });
    writeFileSync(join(dist, 'wasm', name), module.toBinary({}).buffer);
  } finally {
    module.destroy();
  }
}

// tfjs ships CommonJS. Imported from an ES module, Node 20 reads each of its 0.4–1.2 MB files
// three times (module-syntax detection, export lexing, compilation): ~0.3 s of CPU at every
// start, which each task of a cluster job array pays. dist/ imports the packages through
// small ES modules that require() them once and re-export their names.
const TFJS_PACKAGES = ['@tensorflow/tfjs-core', '@tensorflow/tfjs-backend-cpu', '@tensorflow/tfjs-backend-wasm'];
const shims = Object.fromEntries(TFJS_PACKAGES.map((name) => [name, join(dist, 'vendor', `${name.split('/')[1]}.js`)]));
for (const [name, shim] of Object.entries(shims)) writeFileSync(shim, requireShim(name));
for (const file of filesUnder(dist).filter((f) => f.endsWith('.js') && !Object.values(shims).includes(f))) {
  const text = readFileSync(file, 'utf8');
  const shimmed = text.replace(/^(import (?:[^"\n]* from )?)"(@tensorflow\/tfjs-[a-z-]+)";$/gm, (line, head, name) => {
    if (shims[name] == null) return line;
    const path = relative(dirname(file), shims[name]);
    return `${head}"${path.startsWith('.') ? path : `./${path}`}";`;
  });
  if (shimmed !== text) writeFileSync(file, shimmed);
}

/** An ES module that loads a CommonJS package with require() and exports each of its names. */
function requireShim(name) {
  const names = Object.keys(require(name)).filter((key) => key !== 'default' && isIdentifier(key));
  return `// Written by scripts/build.js: ${name} through require(), see there why.
import { createRequire } from 'node:module';
const m = createRequire(import.meta.url)(${JSON.stringify(name)});
export default m;
export const { ${names.join(', ')} } = m;
`;
}

function isIdentifier(key) {
  try {
    new Function(`let ${key};`); // throws for a reserved word, which cannot name a constant
    return /^[A-Za-z_$][\w$]*$/.test(key);
  } catch {
    return false;
  }
}

writeFileSync(join(root, STAMP_FILE), `${JSON.stringify(stamp, null, 1)}\n`);
