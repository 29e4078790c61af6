import pluginVue from 'eslint-plugin-vue'
import tseslint from 'typescript-eslint'
import prettier from 'eslint-config-prettier'
import globals from 'globals'

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'data/**', 'drizzle/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  ...pluginVue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser } },
  },
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      'vue/multi-word-component-names': 'off',
      'no-restricted-globals': [
        'error',
        { name: 'fetch', message: 'Use apiRequest from src/api/http.ts.' },
      ],
    },
  },
  {
    files: ['src/api/http.ts', 'tests/**', 'scripts/**', 'server/**'],
    rules: { 'no-restricted-globals': 'off' },
  },
  {
    files: ['shared/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            'vue',
            'vue-router',
            'pinia',
            'naive-ui',
            'express',
            'drizzle-orm*',
            'better-sqlite3',
            'node:*',
          ],
        },
      ],
    },
  },
  prettier,
)
