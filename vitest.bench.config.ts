import { defineConfig, mergeConfig } from 'vitest/config'
import viteConfig from './vite.config.ts'

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      include: [],
      benchmark: { include: ['tests/bench/**/*.bench.ts'] },
      environment: 'node',
      // One benchmark file at a time: on a two-core machine, the engine's loops running beside the
      // browser would be measured as part of the page's redraw time.
      fileParallelism: false,
    },
  }),
)
