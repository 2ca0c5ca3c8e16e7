// ESLint flat config for the whole workspace (`pnpm lint`; `npm test` runs it too).
// Rule set: ESLint's recommended rules, typescript-eslint's recommended rules (without type information, so a
// run stays fast on a small machine), eslint-plugin-vue's recommended rules for .vue files, and
// eslint-config-prettier last, which turns off every rule that only concerns layout (Prettier owns layout).
import js from '@eslint/js'
import prettier from 'eslint-config-prettier'
import vue from 'eslint-plugin-vue'
import globals from 'globals'
import tseslint from 'typescript-eslint'

export default tseslint.config(
  {
    ignores: [
      '**/node_modules/**',
      '**/dist/**',
      '.data/**',
      'coverage/**',
      'reports/**',
      'tests/artifacts/**',
      'test-results/**',
      'playwright-report/**',
      '**/.stryker-tmp/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...vue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    languageOptions: {
      ecmaVersion: 2023,
      sourceType: 'module',
      globals: { ...globals.node },
    },
    rules: {
      // Unused names are errors, except a leading underscore, which marks a parameter a signature requires
      // (Express error handlers, callbacks) or a value destructured away on purpose.
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
    },
  },
  {
    // Migrations work on a schema that changes under them, so they take an untyped `Kysely<any>`, as Kysely's
    // migration guide does (and they must never import the app's types); everywhere else `any` stays an error.
    files: ['db/migrations/**'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    // Layering (DEVELOPERS.md): routes → services → repositories, and only repositories build queries. Outside
    // repositories and db/ (the connection and table types), kysely may be imported for types only (a
    // transaction's type builds nothing), and no code starts a query or writes raw SQL.
    files: ['apps/api/src/**/*.ts'],
    ignores: ['apps/api/src/repositories/**', 'apps/api/src/db/**'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        { paths: [{ name: 'kysely', message: 'Only repositories build queries.', allowTypeImports: true }] },
      ],
      'no-restricted-syntax': [
        'error',
        {
          selector:
            'CallExpression[callee.property.name=/^(selectFrom|selectNoFrom|insertInto|updateTable|deleteFrom|mergeInto|replaceInto)$/]',
          message: 'Only repositories build queries: add a function to a repository and call it.',
        },
        {
          selector: "TaggedTemplateExpression[tag.name='sql']",
          message: 'Only repositories write SQL: add a function to a repository and call it.',
        },
      ],
    },
  },
  {
    // Routes call services only: no repository, no query builder.
    files: ['apps/api/src/routes/**/*.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          paths: [{ name: 'kysely', message: 'Routes call services; only repositories build queries.' }],
          patterns: [
            { group: ['**/repositories/*'], message: 'Routes call services; only services reach repositories.' },
          ],
        },
      ],
      'no-restricted-syntax': [
        'error',
        {
          selector: 'CallExpression[callee.property.name=/^(selectFrom|insertInto|updateTable|deleteFrom)$/]',
          message: 'Routes call services; only repositories build queries.',
        },
      ],
    },
  },
  {
    files: ['apps/web/src/**/*.{ts,vue}'],
    languageOptions: { globals: { ...globals.browser } },
  },
  prettier,
)
