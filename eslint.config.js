import skipFormatting from '@vue/eslint-config-prettier/skip-formatting';
import { defineConfigWithVueTs, vueTsConfigs } from '@vue/eslint-config-typescript';
import pluginVue from 'eslint-plugin-vue';

// One linter configured once: eslint-plugin-vue's recommended rules, the TypeScript config,
// formatting left to Prettier.
export default defineConfigWithVueTs(
  { name: 'rindwise/files', files: ['**/*.{ts,mts,tsx,vue,js,mjs}'] },
  {
    name: 'rindwise/ignores',
    ignores: [
      'dist/**',
      'node_modules/**',
      'migrations/**',
      'coverage/**',
      '.data/**',
      'uploads/**',
    ],
  },
  pluginVue.configs['flat/recommended'],
  vueTsConfigs.recommended,
  {
    name: 'rindwise/rules',
    rules: {
      'no-console': 'error',
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      'vue/multi-word-component-names': ['error', { ignores: ['App'] }],
    },
  },
  {
    name: 'rindwise/scripts',
    files: ['scripts/**/*.mjs'],
    languageOptions: {
      globals: {
        process: 'readonly',
        console: 'readonly',
        fetch: 'readonly',
        setTimeout: 'readonly',
      },
    },
  },
  skipFormatting,
);
