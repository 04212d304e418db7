import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist', 'node_modules', 'uploads', 'data', 'test-results', 'playwright-report', 'reports', 'dev-dist'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,js,mjs}'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/no-non-null-assertion': 'off',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
  {
    // The engine runs in the browser and on the server alike: nothing from Node, React or the DOM.
    files: ['src/engine/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: ['node:*', 'react', 'react-dom', 'express', 'knex', 'fs', 'path'] }],
      'no-restricted-globals': ['error', 'window', 'document', 'process', 'localStorage', 'navigator'],
    },
  },
  {
    // Shared schemas are pure zod so the server can import them.
    files: ['src/schemas/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: ['@/*', '../*', 'react'] }] },
  },
);
