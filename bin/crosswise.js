#!/usr/bin/env node
// Runs the compiled CLI in dist/ (built by `npm install` through the package's `prepare`
// script). When dist/ is missing or src/ has changed since it was built, it says so on one
// line and runs the TypeScript sources through tsx instead: an edit is never silently
// ignored, and `npm run build` brings back the fast start.
import process from 'node:process';
import { fileURLToPath, URL } from 'node:url';
import { staleBuildReason } from '../scripts/source-stamp.js';

const stale = staleBuildReason(fileURLToPath(new URL('../', import.meta.url)));
let cli;
if (stale == null) {
  cli = await import('../dist/cli.js');
} else {
  process.stderr.write(`crosswise: ${stale}; running the sources through tsx (slow start; \`npm run build\` fixes it)\n`);
  const { register } = await import('tsx/esm/api');
  register();
  cli = await import('../src/cli.ts');
}
process.exitCode = await cli.main(process.argv.slice(2));
