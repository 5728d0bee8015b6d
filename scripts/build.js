// The package's build (run by `npm install` through `prepare`, or `npm run build`):
// compiles src/ to dist/ file by file, so the CLI starts without a TypeScript loader, and
// bundles tfjs-core's gradient registrations, which Node cannot import from the package.
import { copyFileSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join, relative } from 'node:path';
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

writeFileSync(join(root, STAMP_FILE), `${JSON.stringify(stamp, null, 1)}\n`);
