import { availableParallelism } from 'node:os'
import { defineConfig, mergeConfig } from 'vitest/config'
import viteConfig from './vite.config.ts'

// Unit layers: the engine and the API in Node, components in jsdom. Browser tests have their own
// config (vitest.e2e.config.ts) because they need the built client.
//
// Speed on a small machine: worker threads start faster than forked processes, and the engine's
// and the API's test files share one module graph per worker (`isolate: false`): the engine is
// pure, and every API test builds its own app and database, so nothing leaks between files. The
// component tests mock modules per file (`vi.mock`), so they keep a fresh graph per file.
const processStateTests = ['tests/server/operations.test.ts', 'tests/server/upload-limits.test.ts']
// API tests that replace a module with `vi.mock` (to count the engine's runs): in the shared
// module graph the real module is already loaded, so they need a graph of their own.
const moduleMockTests = ['tests/server/event-summaries.test.ts']
// More workers than cores: many API tests spend their time waiting (sign-in throttle delays,
// argon2 on libuv's own threads), so two extra workers fill those waits. On 2 cores this took the
// unit layer from about 124 s to about 92 s of wall time (`npm run bench` is not affected).
const maxWorkers = Math.max(4, availableParallelism())

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      maxWorkers,
      projects: [
        {
          extends: true,
          test: {
            name: 'shared',
            include: ['tests/shared/**/*.test.ts'],
            environment: 'node',
            pool: 'threads',
            isolate: false,
          },
        },
        {
          extends: true,
          test: {
            name: 'server',
            include: ['tests/server/**/*.test.ts'],
            exclude: [...processStateTests, ...moduleMockTests],
            environment: 'node',
            pool: 'threads',
            isolate: false,
            testTimeout: 20_000,
            // The first fixture of a worker hashes a password (argon2) and migrates a database.
            hookTimeout: 20_000,
          },
        },
        {
          // Tests of the process itself (its umask, its worker threads and sockets under load)
          // run in a forked process of their own: a worker thread cannot set the umask. The
          // module-mocking API tests run here too, each file with a module graph of its own.
          extends: true,
          test: {
            name: 'server-process',
            include: [...processStateTests, ...moduleMockTests],
            environment: 'node',
            pool: 'forks',
            testTimeout: 20_000,
            hookTimeout: 20_000,
          },
        },
        {
          extends: true,
          test: {
            name: 'client',
            include: ['tests/client/**/*.test.ts'],
            environment: 'jsdom',
            pool: 'threads',
            setupFiles: ['tests/helpers/client-setup.ts'],
            // The first test of a file pays for importing naive-ui's components (lazily loaded
            // dialogs too): on a busy 2-core machine that alone passed vitest's default 5 s.
            testTimeout: 20_000,
          },
        },
      ],
    },
  }),
)
