// ESLint flat config. Rules are the recommended sets of ESLint, typescript-eslint and angular-eslint, chosen to catch
// mistakes while code changes, not to police style: layout belongs to Prettier (eslint-config-prettier switches off
// every rule it would fight). The few settings below are reasons, not taste; see DEVELOPERS.md "Lint and format".
// Not type-aware (no parserOptions.project): typed linting would build each TypeScript program a second time, and
// `npm test` already runs tsc on them.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import angular from 'angular-eslint';
import prettier from 'eslint-config-prettier';
import globals from 'globals';
import { defineConfig } from 'eslint/config';

// Lines stay readable (issue 14): Prettier wraps code at 120; this catches what it cannot, i.e. long comments.
// Strings, template literals, URLs and regular expressions are left whole so they can still be searched for.
// Set after eslint-config-prettier, which switches max-len off unless it is configured like this.
const MAX_LEN = {
  code: 120,
  ignoreStrings: true,
  ignoreTemplateLiterals: true,
  ignoreUrls: true,
  ignoreRegExpLiterals: true,
};

export default defineConfig(
  { ignores: ['dist/**', 'out-tsc/**', 'coverage/**', 'artifacts/**', '.angular/**', '.data/**', 'node_modules/**'] },
  {
    files: ['**/*.ts', '**/*.mjs', '**/*.js', '**/*.cjs'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // An unused name is usually a leftover of a change; a leading _ marks one kept on purpose (a callback's shape).
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true },
      ],
    },
  },
  {
    // Node-side code: server, migrations, scripts, tests, and this config.
    files: ['server/**', 'migrations/**', 'scripts/**', 'test/**', '*.js', '*.mjs', '**/*.cjs'],
    languageOptions: { globals: { ...globals.node, ...globals.jest } },
  },
  {
    // Specs feed malformed input on purpose, and scripts read untyped JSON replies: `any` is honest there.
    files: ['test/**', 'scripts/**', 'src/**/*.spec.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    // CommonJS files: jest.config.js and the worker entry that loads tsx.
    files: ['*.js', '**/*.cjs'],
    languageOptions: { sourceType: 'commonjs' },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    languageOptions: { globals: globals.browser },
    rules: {
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'tt', style: 'kebab-case' }],
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'tt', style: 'camelCase' }],
    },
  },
  {
    // The engine and rules barrels run the shared zod schemas when loaded (zod's whole 450 kB namespace). The calc
    // page and the editor must be usable fast, so their first view imports helpers from their own modules; the code
    // that validates is loaded where it is needed (DEVELOPERS.md, "a screen"). Type imports cost nothing.
    files: ['src/app/ui/**/*.ts', 'src/app/core/**/*.ts', 'src/app/features/calcs/{calc-page,editor}/*.ts'],
    // Loaded on their own: the live engine, and panels of tabs built when opened.
    ignores: ['**/*.spec.ts', '**/live-engine.ts', '**/minimum-diameters.ts', '**/attachments-panel.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: 'shared/(engine|rules)$|shared/schemas/.*\\.schema$',
              allowTypeImports: true,
              message: 'Import from the module that defines it; these run zod schemas on load.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['src/**/*.spec.ts'],
    languageOptions: { globals: globals.jest },
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
    // `x == null` tests null and undefined at once, as in TypeScript code.
    rules: { '@angular-eslint/template/eqeqeq': ['error', { allowNullOrUndefined: true }] },
  },
  prettier,
  { files: ['**/*.ts', '**/*.mjs', '**/*.js', '**/*.cjs'], rules: { 'max-len': ['error', MAX_LEN] } },
);
