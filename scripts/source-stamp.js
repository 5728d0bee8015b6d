// The fingerprint of what dist/ was built from, shared by the build (which writes it) and
// the bin (which checks it before running dist/).
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

/** Where the build writes the fingerprint of the sources it compiled. */
export const STAMP_FILE = 'dist/source-stamp.json';

/** Files whose content decides the build's output, relative to `root`: everything under src/, and the build script. */
function inputFiles(root) {
  const files = readdirSync(join(root, 'src'), { recursive: true, withFileTypes: true })
    .filter((entry) => entry.isFile())
    .map((entry) => relative(root, join(entry.parentPath, entry.name)));
  return [...files, join('scripts', 'build.js')].sort();
}

/** Size and modification time of each input file: cheap to compare at every start. */
function fileTimes(root, files) {
  return Object.fromEntries(files.map((file) => {
    const { size, mtimeMs } = statSync(join(root, file));
    return [file, `${size} ${mtimeMs}`];
  }));
}

/** A SHA-256 over the path and content of every input file (hex). */
function contentHash(root, files) {
  const hash = createHash('sha256');
  for (const file of files) hash.update(`${file}\0`).update(readFileSync(join(root, file))).update('\0');
  return hash.digest('hex');
}

/** The fingerprint of the sources under `root`, as the build stores it. */
export function sourceStamp(root) {
  const files = inputFiles(root);
  return { hash: contentHash(root, files), files: fileTimes(root, files) };
}

/**
 * Why dist/ under `root` must not run, or null when it may: it is missing, or a source
 * changed since it was built. Sizes and times are compared first (a few milliseconds);
 * only when one differs is the content hashed, so a file touched but not changed (a git
 * checkout) still runs dist/. A package without src/ has nothing to compare: it runs dist/.
 */
export function staleBuildReason(root) {
  const stampPath = join(root, STAMP_FILE);
  if (!existsSync(stampPath)) return 'dist/ has not been built';
  if (!existsSync(join(root, 'src'))) return null;
  const stamp = JSON.parse(readFileSync(stampPath, 'utf8'));
  const files = inputFiles(root);
  const times = fileTimes(root, files);
  const same = files.length === Object.keys(stamp.files).length && files.every((file) => stamp.files[file] === times[file]);
  return same || contentHash(root, files) === stamp.hash ? null : 'src/ has changed since dist/ was built';
}
