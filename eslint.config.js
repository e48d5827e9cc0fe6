import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import importX, { createNodeResolver } from 'eslint-plugin-import-x';
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
    // Without a resolver that knows .ts, import-x cannot resolve our extensionless imports and the
    // zones below would pass every import unchecked.
    settings: {
      'import-x/resolver-next': [
        createNodeResolver({ extensions: ['.ts', '.tsx', '.js', '.mjs', '.json', '.node'] }),
      ],
    },
    rules: {
      ...reactHooks.configs.recommended.rules,
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-explicit-any': 'error',
      // One direction for imports: shared depends on nothing of ours; src, server and workers
      // may use shared; src takes only types from workers and nothing from server. src/cli runs
      // the shared code in Node: it may import shared/ and Node only.
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
            {
              target: './src/cli',
              from: ['./src', './workers'],
              except: ['./cli'],
              message: 'src/cli may import only shared/ and Node.',
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
    ignores: ['src/cli/**'],
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
            {
              group: ['**/cli/*'],
              message: 'src/cli holds the Node command-line tools; the client never imports them.',
            },
          ],
        },
      ],
    },
  },
);
