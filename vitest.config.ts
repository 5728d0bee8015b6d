import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.{ts,tsx}'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // Ink draws only the final frame when it believes it runs under CI (the CI variable);
    // the terminal tests check live redraws, so test processes and their children see CI=false.
    env: { CI: 'false', CONTINUOUS_INTEGRATION: 'false' },
  },
});
