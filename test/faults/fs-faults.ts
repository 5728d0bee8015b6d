// Injects file-system faults into the code under test without touching src/: the
// functions of node:fs are replaced on the module object and copied to its ESM named
// exports (node:module syncBuiltinESMExports), so `import { writeFileSync } from
// 'node:fs'` in src sees the faulty one. Tests run as root, where chmod cannot make a
// folder unreadable or unwritable, so errors are thrown as the kernel would report them.
import fs from 'node:fs';
import { syncBuiltinESMExports } from 'node:module';

/** The errno codes the tests inject and their kernel messages (Linux errno.h / strerror). */
export const ERRNO = {
  ENOSPC: 'no space left on device',
  EACCES: 'permission denied',
  EIO: 'i/o error',
} as const;

/** An fs function that takes a path first. */
type PathCall = 'writeFileSync' | 'mkdirSync' | 'renameSync' | 'readdirSync' | 'readFileSync' | 'openSync' | 'statSync';

/** What each fs function is called in error messages (its syscall). */
const SYSCALL: Record<PathCall, string> = {
  writeFileSync: 'write', mkdirSync: 'mkdir', renameSync: 'rename', readdirSync: 'scandir', readFileSync: 'open', openSync: 'open', statSync: 'stat',
};

/** An error as node:fs throws it for `code` on `path`. */
export function errnoError(code: keyof typeof ERRNO, call: PathCall, path: string): NodeJS.ErrnoException {
  return Object.assign(new Error(`${code}: ${ERRNO[code]}, ${SYSCALL[call]} '${path}'`), { code, errno: -1, syscall: SYSCALL[call], path });
}

/**
 * Makes `call` throw `code` for every path that `matches` (the first argument, as text);
 * returns the function that undoes it.
 */
export function injectFault(call: PathCall, code: keyof typeof ERRNO, matches: (path: string) => boolean): () => void {
  const real = fs[call] as (...args: unknown[]) => unknown;
  const faulty = (...args: unknown[]): unknown => {
    const path = String(args[0]);
    if (matches(path)) throw errnoError(code, call, path);
    return real(...args);
  };
  (fs as unknown as Record<string, unknown>)[call] = faulty;
  syncBuiltinESMExports();
  return () => {
    (fs as unknown as Record<string, unknown>)[call] = real;
    syncBuiltinESMExports();
  };
}
