// ESLint for the whole workspace: typescript-eslint's recommended rules (syntax only, no type information, so it
// stays fast), react-hooks in the React code, and the import boundaries of docs/CONVENTIONS.md.
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import { defineConfig } from 'eslint/config';
import comments from '@eslint-community/eslint-plugin-eslint-comments/configs';
import { createNodeResolver, importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

const root = import.meta.dirname;

/** Boundaries of a client app: shared (components, lib, config) -> features -> app, and no feature imports another. */
function clientZones(app) {
  const src = `./apps/${app}/src`;
  const features = readdirSync(`${root}/apps/${app}/src/features`, { withFileTypes: true }).filter((d) =>
    d.isDirectory(),
  );
  return [
    {
      target: ['components', 'lib', 'config'].map((d) => `${src}/${d}`),
      from: [`${src}/features`, `${src}/app`],
      message: 'Shared code (components, lib, config) may not import a feature or the app.',
    },
    { target: `${src}/features`, from: `${src}/app`, message: 'A feature may not import the app.' },
    ...features.map((f) => ({
      target: `${src}/features/${f.name}`,
      from: `${src}/features`,
      except: [`./${f.name}`],
      message: 'A feature may not import another feature; compose them in app/.',
    })),
  ];
}

export default defineConfig(
  { ignores: ['**/node_modules/', '**/dist/', 'data/', 'coverage/', 'test-results/', 'playwright-report/'] },
  { linterOptions: { reportUnusedDisableDirectives: 'error' } },
  js.configs.recommended,
  tseslint.configs.recommended,
  comments.recommended,
  {
    rules: {
      // a disabled rule says why on the same line (`-- reason`)
      '@eslint-community/eslint-comments/require-description': 'error',
      // `_`-prefixed names are deliberately unused (Express's four-argument error handler, skipped tuple items)
      // Prettier lays long casts out over lines this rule reads as ambiguous; Prettier owns layout (as in eslint-config-prettier)
      'no-unexpected-multiline': 'off',
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' },
      ],
    },
  },
  {
    files: ['apps/customer/**/*.{ts,tsx}', 'apps/shop/**/*.{ts,tsx}', 'packages/ui/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs['recommended-latest'].rules,
      // an error, not a warning: the test command fails only on errors, and a warning nobody reads is no check
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver-next': [createNodeResolver({ extensions: ['.ts', '.tsx', '.js', '.json'] })] },
    rules: {
      'import-x/no-restricted-paths': [
        'error',
        {
          basePath: root,
          zones: [
            ...clientZones('customer'),
            ...clientZones('shop'),
            { target: './packages', from: './apps', message: 'A package may not import an app.' },
            {
              target: './apps/api/src/lib',
              from: ['./apps/api/src/modules', './apps/api/src/middleware'],
              message: 'lib/ may not import the HTTP layer (modules/, middleware/).',
            },
          ],
        },
      ],
    },
  },
  {
    // small CommonJS helpers that tests run as plain Node child processes
    files: ['**/*.cjs'],
    languageOptions: {
      sourceType: 'commonjs',
      globals: {
        require: 'readonly',
        process: 'readonly',
        module: 'writable',
        __dirname: 'readonly',
        console: 'readonly',
      },
    },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
);
