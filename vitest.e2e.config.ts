import { defineConfig } from 'vitest/config'

// Real Chromium against the built client served by the real server; one file at a time so two
// browsers never compete for the machine's two cores.
export default defineConfig({
  test: {
    include: ['tests/e2e/**/*.test.ts'],
    environment: 'node',
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 90_000,
  },
})
