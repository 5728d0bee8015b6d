import js from '@eslint/js';
import tseslint from 'typescript-eslint';

// Computation never imports UI, and randomness always comes from a seeded generator.
const noHiddenRandomness = {
  selector: "MemberExpression[object.name='Math'][property.name='random']",
  message: 'Math.random is forbidden: pass a seeded generator (see src/collect/rng.ts).',
};

export default tseslint.config(
  { ignores: ['node_modules/**', 'runs/**', 'dist/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-properties': ['error', { object: 'Math', property: 'random', message: noHiddenRandomness.message }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    ignores: ['src/tui/**', 'src/cli.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['ink', 'ink/*', 'ink-*', 'react', 'react/*', 'react-dom'], message: 'Only src/tui/ may import ink or react: computation never imports UI.' },
          { group: ['**/tui/**'], message: 'Only cli.ts may import the terminal UI.' },
        ],
      }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    ignores: ['src/learn/**'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['@tensorflow/*'], message: 'Only src/learn/ imports TensorFlow.js.' },
        ],
      }],
    },
  },
  {
    files: ['test/**/*.{ts,tsx}'],
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
);
