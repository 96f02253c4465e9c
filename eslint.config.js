import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

const noProcessEnv = {
  'no-restricted-properties': [
    'error',
    { object: 'process', property: 'env', message: 'Read configuration through server/env.ts only.' },
  ],
};

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'drizzle/**', '.data/**', 'bench/**', 'tests/e2e/artifacts/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      ...noProcessEnv,
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    // One-way imports: shared/ and analysis/ are leaves; analysis/ imports no zod, DB or React either.
    files: ['shared/**/*.ts', 'analysis/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/src/**', '**/server/**', '../src', '../server'], message: 'shared/ and analysis/ import from neither src/ nor server/.' }] },
      ],
    },
  },
  {
    files: ['analysis/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['**/src/**', '**/server/**', '**/shared/**'], message: 'analysis/ is pure: no imports from src/, server/ or shared/.' },
            { group: ['zod', 'pg', 'drizzle-orm', 'drizzle-orm/*', 'react', 'node:*'], message: 'analysis/ is pure statistics: no I/O, no zod, no React.' },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/server/**'], message: 'The client never imports server code.' }] }],
    },
  },
  {
    // The env module itself, the dependency-free bootstrap, and scripts handing env to child processes.
    files: ['server/env.ts', 'scripts/bootstrap.mjs', 'scripts/dev.ts'],
    rules: { 'no-restricted-properties': 'off' },
  },
);
