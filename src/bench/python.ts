import { spawnSync } from 'node:child_process';

// The first python3 on PATH may be a private one (pyenv, conda) that cannot see the
// system's packages (Debian installs python3-torch and python3-sklearn for /usr/bin/python3),
// so every candidate is tried in turn.
const CANDIDATES = ['python3', '/usr/bin/python3', '/usr/local/bin/python3', 'python'];

/** One thread for every BLAS and OpenMP pool a Python process may start. */
export const ONE_THREAD: Readonly<Record<string, string>> = {
  OPENBLAS_NUM_THREADS: '1', OMP_NUM_THREADS: '1', MKL_NUM_THREADS: '1', BLIS_NUM_THREADS: '1',
};

/** The first Python interpreter that imports every module named, or null. */
export function findPython(modules: readonly string[]): string | null {
  const probe = `import ${modules.join(', ')}`;
  return CANDIDATES.find((python) => spawnSync(python, ['-c', probe], { stdio: 'ignore', env: { ...process.env, ...ONE_THREAD } }).status === 0) ?? null;
}

/** Runs a Python script on one thread and parses the JSON object it prints last. */
export function runPythonJson<T>(python: string, script: string, args: readonly string[]): T {
  const run = spawnSync(python, [script, ...args], { encoding: 'utf8', env: { ...process.env, ...ONE_THREAD }, maxBuffer: 1 << 24 });
  if (run.status !== 0) throw new Error(`${script} failed: ${run.stderr.trim().split('\n').pop()}`);
  return JSON.parse(run.stdout.trim().split('\n').pop() ?? '') as T;
}
