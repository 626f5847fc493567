import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'test-results/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['**/*.{mjs,js}', 'src/cli/**', 'test/**'],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    // The engine stays pure: no React, no DOM, no storage, no I/O.
    files: ['src/core/**/*.ts'],
    ignores: ['src/core/**/*.test.ts'],
    languageOptions: { globals: {} },
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['react', 'react-dom', 'react-dom/*', 'react/*'], message: 'src/core must not import React.' },
          { group: ['idb', 'dexie', 'fake-indexeddb', 'fake-indexeddb/*'], message: 'src/core must not touch storage.' },
          { group: ['node:*', 'fs', 'path', 'process'], message: 'src/core must not do I/O.' },
          { group: ['**/ui/**', '**/store/**', '**/cli/**'], message: 'src/core must not import the layers above it.' },
        ],
      }],
      'no-restricted-globals': ['error', 'window', 'document', 'localStorage', 'sessionStorage', 'indexedDB', 'navigator', 'fetch'],
    },
  },
);
