// Lint guards the architecture as well as the code: no import cycles, imports that flow
// one way (contracts ← api, contracts ← web; in web shared → features → app, no feature
// reaching into another), and a pure engineering core.
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import importX from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';

// Every folder under web/src/features is a feature; a new one is covered without editing this file.
const webFeatures = readdirSync(new URL('./web/src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

export default tseslint.config(
  {
    ignores: [
      '**/dist/**',
      '**/node_modules/**',
      '**/coverage/**',
      '.data/**',
      '.data-test/**',
      'artifacts/**',
      'web/.scratch/**',
      '**/*.d.ts',
      'test-fixtures/index.js',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [
        createTypeScriptImportResolver({ project: ['contracts/tsconfig.json', 'api/tsconfig.json', 'web/tsconfig.json'], noWarnOnMultipleProjects: true }),
      ],
    },
    languageOptions: { globals: { ...globals.node } },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-self-import': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': 'off',
      '@typescript-eslint/no-explicit-any': 'warn',
      '@typescript-eslint/no-require-imports': 'off',
    },
  },
  {
    files: ['contracts/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['**/api/**', '**/web/**', '@shuntwise/api', '@shuntwise/web', '@nestjs/*', 'react', 'sequelize*'],
              message: 'contracts is shared by web and api and depends on neither',
            },
          ],
        },
      ],
    },
  },
  {
    // Repositories are the only ORM callers: a model class, raw queries, query operators and the
    // connection itself are imported only by repositories, models, modules (which register models),
    // the database layer, migrations and the dev stack and seeders. Services, controllers and the
    // rest take a repository (of their own module or another module's exported one) and, for a
    // multi-step write, UnitOfWork. Type-only imports of models (a return type) are fine; so are
    // sequelize's error classes and the Transaction type.
    files: ['api/src/**/*.ts'],
    ignores: [
      'api/src/**/*.repository.ts',
      'api/src/**/*.model.ts',
      'api/src/**/*.module.ts',
      'api/src/database/**',
      'api/src/dev/**',
      'api/src/seed/**',
      'api/src/**/*.spec.ts',
    ],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'sequelize',
              importNames: ['QueryTypes', 'Op', 'Sequelize', 'literal', 'fn', 'col', 'where'],
              message: 'queries live in repositories (*.repository.ts)',
            },
            {
              name: 'sequelize-typescript',
              importNames: ['Sequelize'],
              allowTypeImports: true,
              message: 'services take repositories and UnitOfWork (api/src/database/unit-of-work.ts), not the connection',
            },
            { name: '@nestjs/sequelize', importNames: ['InjectModel', 'InjectConnection'], message: 'only repositories inject models or the connection' },
          ],
          patterns: [
            {
              group: ['**/*.model'],
              allowTypeImports: true,
              message: 'only repositories (and modules registering models) use model classes; import the type, ask the repository',
            },
          ],
        },
      ],
    },
  },
  {
    // Every file of the core, no exemptions: its HTTP face lives in api/src/engineering-routes.
    files: ['api/src/engineering/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['@nestjs/*', 'sequelize*', 'nestjs-zod', '../*'],
              message: 'the engineering core stays pure: no Nest, no database, nothing from other api folders',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['api/src/extraction/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['@nestjs/*', 'sequelize*'], message: 'extraction stays pure: no Nest, no database' }] }],
    },
  },
  {
    files: ['web/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            // features never reach into each other; shared code never into features or app
            ...webFeatures.map((f) => ({
              target: `./web/src/features/${f}`,
              from: './web/src/features',
              except: [`./${f}`],
              message: 'a feature may not import another feature; move shared code to web/src/components or web/src/lib',
            })),
            { target: './web/src/features', from: './web/src/app', message: 'features may not import from app' },
            {
              target: ['./web/src/components', './web/src/lib', './web/src/theme', './web/src/hooks', './web/src/utils'],
              from: ['./web/src/features', './web/src/app'],
              message: 'shared code may not import features or app',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['**/*.mjs', '**/*.cjs', '**/*.js'],
    languageOptions: { globals: { ...globals.node } },
  },
);
