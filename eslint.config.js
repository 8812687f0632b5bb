import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import importX from 'eslint-plugin-import-x';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import fs from 'node:fs';

// Features do not import each other: one zone per folder in src/features.
const featureZones = fs
  .readdirSync('src/features', { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => ({ target: `./src/features/${d.name}`, from: './src/features', except: [`./${d.name}`], message: 'features do not import each other' }));

export default tseslint.config(
  // tests/lint/fixtures hold planted mistakes that tests/lint/rules.test.ts lints on purpose.
  { ignores: ['dist/**', 'node_modules/**', 'drizzle/**', 'test-results/**', 'playwright-report/**', 'data/**', '.tmp/**', 'tests/lint/fixtures/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    plugins: { 'import-x': importX, 'react-hooks': reactHooks },
    settings: {
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: './tsconfig.json' })],
      // Without these, TypeScript files are not followed and no-cycle silently checks nothing.
      'import-x/extensions': ['.ts', '.tsx', '.js', '.mjs', '.cjs'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
      'import-x/no-cycle': 'error',
      'import-x/no-unresolved': 'error',
      // Imports flow one way: shared <- (src | server); inside src: components, lib -> features -> app; services below routes and middleware.
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            { target: './shared', from: ['./src', './server', './fakes', './catalog-seed'], message: 'shared/ must not import app code' },
            { target: './src', from: ['./server', './fakes', './catalog-seed'], message: 'the client must not import server code' },
            { target: './server', from: ['./src'], message: 'the server must not import client code' },
            {
              target: './server/services',
              from: ['./server/middleware', './server/routes'],
              message: 'services throw domain errors (server/services/errors.ts) and know nothing of HTTP: no imports from middleware/ or routes/',
            },
            { target: './src/features', from: './src/app', message: 'features must not import app/' },
            { target: ['./src/components', './src/lib'], from: ['./src/features', './src/app'], message: 'components/ and lib/ sit below features/' },
            ...featureZones,
          ],
        },
      ],
    },
  },
);
