import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import moduleTable from './lint/module-table.js';

// The module table of src/, top to bottom (DEVELOPERS.md): a module imports only from
// modules above it. random.ts and stats/ come first, so every module may use them.
const MODULE_ORDER = [
  'random.ts', 'input-limits.ts', 'stats', 'world', 'senses', 'collect', 'noise', 'learn', 'probe',
  'results', 'report', 'experiment', 'bench', 'tui', 'commands', 'cli.ts',
];

const TABLE = {
  root: 'src',
  order: MODULE_ORDER,
  // Both build on results/; neither depends on the other.
  apart: [['experiment', 'report']],
  packages: [
    { patterns: ['@tensorflow/*'], modules: ['learn'], message: 'Only src/learn/ imports TensorFlow.js.' },
    { patterns: ['ink', 'ink-*', 'react', 'react-dom'], modules: ['tui'], message: 'Only src/tui/ imports ink or react: computation never imports UI.' },
  ],
};

export default tseslint.config(
  { ignores: ['node_modules/**', 'runs/**', 'dist/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      // Type-aware: a promise nobody awaits loses its errors (e.g. in the async runner).
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-misused-promises': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { crosswise: moduleTable },
    rules: {
      'no-restricted-properties': ['error', { object: 'Math', property: 'random', message: 'Math.random is forbidden: pass a seeded generator (see src/random.ts).' }],
      'crosswise/module-order': ['error', TABLE],
      // Type-only imports join the cycle check once src/senses/ holds no type-level cycle.
      'crosswise/no-import-cycle': ['error', { root: 'src', types: true }],
    },
  },
);
