import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { builtinModules } from 'node:module';

// Dependencies flow one way: src and server import shared, never each other; shared imports neither.
const noServer = { group: ['**/server/**', '../server/*', '../../server/*'], message: 'The client never imports server code.' };
const noClient = { group: ['@/*', '**/src/**'], message: 'The server never imports client code.' };
const sharedOnly = {
  // Node's own modules by their bare names too (fs, crypto, path …), matched exactly
  paths: builtinModules.map((name) => ({ name, message: 'shared/ is pure and runs in the browser too: no Node modules.' })),
  patterns: [
    { group: ['@/*', '**/src/**', '**/server/**'], message: 'shared/ imports neither src/ nor server/.' },
    {
      group: ['drizzle-orm', 'drizzle-orm/*', 'better-sqlite3', 'node:*', 'express'],
      message: 'shared/ is pure and runs in the browser too: no Node modules, no database.',
    },
  ],
};

export default tseslint.config(
  { ignores: ['dist/**', 'dist-server/**', 'node_modules/**', 'drizzle/**', '.tmp/**', 'data/**', 'dev-dist/**', 'test-results/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' }],
      '@typescript-eslint/no-namespace': 'off',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: { ...reactHooks.configs.recommended.rules, 'no-restricted-imports': ['error', { patterns: [noServer] }] },
  },
  {
    files: ['src/features/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            noServer,
            { group: ['@/features/*', '../../*', '!../../..'], message: 'Features do not import features; compose them in src/app/routes.' },
          ],
        },
      ],
    },
  },
  { files: ['server/**/*.ts'], rules: { 'no-restricted-imports': ['error', { patterns: [noClient] }] } },
  { files: ['shared/**/*.ts'], ignores: ['shared/**/*.test.ts'], rules: { 'no-restricted-imports': ['error', sharedOnly] } },
);
