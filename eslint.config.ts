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
    // A test may define several small stand-in components beside each other.
    files: ['tests/**'],
    rules: { 'vue/one-component-per-file': 'off' },
  },
  {
    // Dialogs and the dark theme load on first use; a direct import would put them back into
    // every page's first download.
    files: ['src/**'],
    ignores: ['src/components/AppDialogLayer.vue', 'src/theme/naiveDark.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'naive-ui',
              importNames: ['useDialog', 'NDialogProvider'],
              message: 'Use useAppDialog from src/composables/useAppDialog.ts.',
            },
            {
              name: 'naive-ui',
              importNames: ['darkTheme'],
              message: 'Use naiveDarkTheme from src/theme/naiveDark.ts.',
            },
          ],
          patterns: [
            {
              regex: '^(\\.\\./)+shared(/|$)',
              message: 'Import shared code through the @shared/ alias.',
            },
          ],
        },
      ],
    },
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
  {
    // Layers on the server: routes map HTTP to the domain (server/resources, server/card, ...)
    // and mount routers; nothing below them reaches back up into a route.
    files: ['server/**'],
    ignores: ['server/routes/**', 'server/app.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '(^|/)routes(/|$)',
              message:
                'Only routes and server/app.ts import from server/routes/. Move what you need into the domain layer (server/resources/ or the area folder).',
            },
          ],
        },
      ],
    },
  },
  {
    // A route does not borrow another route's code: shared pieces live in the domain layer or in
    // server/http/. Only the files that mount routers import routers.
    files: ['server/routes/**'],
    ignores: ['server/routes/team-resources.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^\\./(?!team-resource-router$)',
              message:
                'A route imports no other route. Put the shared piece in server/resources/ or server/http/; mount routers in team-resources.ts or server/app.ts.',
            },
          ],
        },
      ],
    },
  },
  prettier,
)
