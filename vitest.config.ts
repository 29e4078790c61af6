import { defineConfig, mergeConfig } from 'vitest/config'
import viteConfig from './vite.config.ts'

// Unit layers: the engine and the API in Node, components in jsdom. Browser tests have their own
// config (vitest.e2e.config.ts) because they need the built client.
export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      projects: [
        {
          extends: true,
          test: {
            name: 'shared',
            include: ['tests/shared/**/*.test.ts'],
            environment: 'node',
          },
        },
        {
          extends: true,
          test: {
            name: 'server',
            include: ['tests/server/**/*.test.ts'],
            environment: 'node',
            testTimeout: 20_000,
          },
        },
        {
          extends: true,
          test: {
            name: 'client',
            include: ['tests/client/**/*.test.ts'],
            environment: 'jsdom',
            setupFiles: ['tests/helpers/client-setup.ts'],
          },
        },
      ],
    },
  }),
)
