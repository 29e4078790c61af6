import { defineConfig, mergeConfig } from 'vitest/config'
import viteConfig from './vite.config.ts'

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      include: [],
      benchmark: { include: ['tests/bench/**/*.bench.ts'] },
      environment: 'node',
    },
  }),
)
