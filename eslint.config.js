// ESLint 9 flat config: typescript-eslint's and angular-eslint's recommended rules, lines at most 120 columns.
// Prettier formats first (npm test runs it before this); nothing here argues with its layout.
import js from '@eslint/js';
import angular from 'angular-eslint';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['node_modules/', 'dist/', '.angular/', '.data/', 'test-artifacts/', 'coverage/', 'samples/'] },
  {
    files: ['**/*.ts', '**/*.js', '**/*.mjs'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      // Prettier wraps code at 120; this catches what it cannot wrap: long strings, SQL and comments.
      'max-len': ['error', { code: 120, ignoreUrls: true, ignoreRegExpLiterals: true }],
      // `_name` marks a parameter a signature needs but the body does not use (Express handlers, callbacks).
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true },
      ],
    },
  },
  {
    files: ['frontend/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'rm', style: 'kebab-case' }],
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'rm', style: 'camelCase' }],
    },
  },
  {
    files: ['frontend/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
);
