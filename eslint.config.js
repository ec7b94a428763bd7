import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import vue from 'eslint-plugin-vue';

export default tseslint.config(
  {
    ignores: [
      'node_modules/',
      'dist/',
      'dist-electron/',
      'dist-cli/',
      'release/',
      'artifacts/',
      'coverage/',
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
    // TypeScript itself checks undefined names (with the right lib per tsconfig);
    // typescript-eslint advises turning the core rule off for TS and Vue files.
    files: ['**/*.ts', '**/*.vue'],
    rules: { 'no-undef': 'off' },
  },
  {
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      'vue/multi-word-component-names': 'off',
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
    },
  },
  {
    // core/ is pure: no Node, DOM, Electron or UI imports (DESIGN.md section 2).
    files: ['core/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            'node:*',
            'fs',
            'path',
            'os',
            'electron',
            'vue',
            'chart.js',
            '../renderer/*',
            '../electron/*',
          ],
        },
      ],
      'no-restricted-globals': ['error', 'window', 'document', 'process', 'Date', 'localStorage'],
    },
  },
);
