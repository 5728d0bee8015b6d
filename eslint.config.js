import js from '@eslint/js';
import tseslint from 'typescript-eslint';

// Computation never imports UI, only src/learn/ touches TensorFlow.js, and randomness always
// comes from a seeded generator. Flat config replaces a rule wholesale when several blocks
// match a file, so the import patterns are grouped by disjoint sets of files.
const inkImports = [
  { group: ['ink', 'ink/*', 'ink-*', 'react', 'react/*', 'react-dom'], message: 'Only src/tui/ may import ink or react: computation never imports UI.' },
];
const uiImports = [
  ...inkImports,
  { group: ['**/tui/**'], message: 'Only the command line (cli.ts, src/commands/) may import the terminal UI.' },
];
const tensorflowImports = [
  { group: ['@tensorflow/*'], message: 'Only src/learn/ imports TensorFlow.js.' },
];

export default tseslint.config(
  { ignores: ['node_modules/**', 'runs/**', 'dist/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-properties': ['error', { object: 'Math', property: 'random', message: 'Math.random is forbidden: pass a seeded generator (see src/random.ts).' }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    ignores: ['src/tui/**', 'src/cli.ts', 'src/commands/**', 'src/learn/**'],
    rules: { 'no-restricted-imports': ['error', { patterns: [...uiImports, ...tensorflowImports] }] },
  },
  {
    files: ['src/learn/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: uiImports }] },
  },
  {
    files: ['src/cli.ts', 'src/commands/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [...inkImports, ...tensorflowImports] }] },
  },
  {
    files: ['src/tui/**/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': ['error', { patterns: tensorflowImports }] },
  },
  {
    files: ['test/**/*.{ts,tsx}'],
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
);
