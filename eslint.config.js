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
    files: ['apps/web/src/**/*.{ts,vue}'],
    languageOptions: { globals: { ...globals.browser } },
  },
  prettier,
)
