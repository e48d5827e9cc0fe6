import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import importX from 'eslint-plugin-import-x';
import globals from 'globals';

export default tseslint.config(
  {
    ignores: ['dist', 'node_modules', 'data', 'test-results', 'playwright-report', 'e2e/artifacts'],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginQuery.configs['flat/recommended'],
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    plugins: { 'react-hooks': reactHooks, 'import-x': importX },
    rules: {
      ...reactHooks.configs.recommended.rules,
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-explicit-any': 'error',
      // One direction for imports: shared depends on nothing of ours; src, server and workers
      // may use shared; src takes only types from workers and nothing from server.
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            {
              target: './shared',
              from: ['./src', './server', './workers'],
              message: 'shared/ must stay runtime-neutral.',
            },
            {
              target: './src',
              from: './server',
              message: 'The client talks to the server over HTTP only.',
            },
            { target: './server', from: ['./src', './workers'] },
            { target: './workers', from: ['./src', './server'] },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/workers/*'],
              allowTypeImports: true,
              message: 'Import only types from workers; create workers through src/lib.',
            },
          ],
        },
      ],
    },
  },
);
