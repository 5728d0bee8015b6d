import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { sourceStamp, staleBuildReason, STAMP_FILE } from '../../scripts/source-stamp.js';
import { main } from '../../src/cli.js';

/** A package folder with two sources, a build script, and a stamp of them as the build leaves it. */
function builtPackage(): string {
  const root = mkdtempSync(join(tmpdir(), 'crosswise-stamp-'));
  mkdirSync(join(root, 'src', 'world'), { recursive: true });
  mkdirSync(join(root, 'scripts'));
  mkdirSync(join(root, 'dist'));
  writeFileSync(join(root, 'src', 'cli.ts'), 'export const a = 1;\n');
  writeFileSync(join(root, 'src', 'world', 'grid.ts'), 'export const b = 2;\n');
  writeFileSync(join(root, 'scripts', 'build.js'), '// build\n');
  writeFileSync(join(root, STAMP_FILE), JSON.stringify(sourceStamp(root)));
  return root;
}

let root: string;
beforeEach(() => { root = builtPackage(); });

describe('whether dist/ may run', () => {
  it('runs dist/ built from the sources as they are', () => {
    expect(staleBuildReason(root)).toBeNull();
  });

  it('still runs dist/ when a source was touched but not changed (a git checkout)', () => {
    utimesSync(join(root, 'src', 'cli.ts'), new Date(), new Date(Date.now() + 60_000));
    expect(staleBuildReason(root)).toBeNull();
  });

  it('refuses dist/ when a source changed, was added or was removed, or the build script changed', () => {
    const stale = 'src/ has changed since dist/ was built';
    writeFileSync(join(root, 'src', 'cli.ts'), 'export const a = 3;\n');
    expect(staleBuildReason(root)).toBe(stale);
    root = builtPackage();
    writeFileSync(join(root, 'src', 'world', 'new.ts'), '');
    expect(staleBuildReason(root)).toBe(stale);
    root = builtPackage();
    rmSync(join(root, 'src', 'world', 'grid.ts'));
    expect(staleBuildReason(root)).toBe(stale);
    root = builtPackage();
    writeFileSync(join(root, 'scripts', 'build.js'), '// build, changed\n');
    expect(staleBuildReason(root)).toBe(stale);
  });

  it('refuses a package that was never built, and trusts dist/ in one shipped without src/', () => {
    rmSync(join(root, STAMP_FILE));
    expect(staleBuildReason(root)).toBe('dist/ has not been built');
    root = builtPackage();
    rmSync(join(root, 'src'), { recursive: true });
    expect(staleBuildReason(root)).toBeNull();
  });
});

describe('the crosswise bin', () => {
  const repository = fileURLToPath(new URL('../../', import.meta.url));

  it('runs dist/ silently when it is current, else the sources after a one-line notice; either prints what the sources print', async () => {
    const lines: string[] = [];
    const log = vi.spyOn(console, 'log').mockImplementation((text: string) => { lines.push(text); });
    await main(['--help']);
    log.mockRestore();
    const stale = staleBuildReason(repository);
    const run = spawnSync(process.execPath, [join(repository, 'bin', 'crosswise.js'), '--help'], { encoding: 'utf8' });
    expect(run.status).toBe(0);
    expect(run.stdout).toBe(`${lines.join('\n')}\n`);
    expect(run.stderr).toBe(stale == null ? '' : `crosswise: ${stale}; running the sources through tsx (slow start; \`npm run build\` fixes it)\n`);
  });
});
