import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/** The package's bin, run with `node` directly (not through npx). */
export const CLI = fileURLToPath(new URL('../../bin/crosswise.js', import.meta.url));

/** Runs the CLI with `args` and returns its wall time in seconds; a non-zero exit throws with its first error line. */
export function timeCli(args: readonly string[]): number {
  const started = performance.now();
  const result = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  if (result.status !== 0) throw new Error(`crosswise ${args.join(' ')} exited with ${result.status}: ${result.stderr.trim().split('\n')[0]}`);
  return (performance.now() - started) / 1000;
}

/** Wall time of `node bin/crosswise.js --help`: what every command pays before it starts working. */
export const startupSeconds = (): number => timeCli(['--help']);
