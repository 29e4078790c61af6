import { fileURLToPath, URL } from 'node:url'
import { readFileSync } from 'node:fs'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'

const packageJson = JSON.parse(
  readFileSync(new URL('./package.json', import.meta.url), 'utf8'),
) as {
  version: string
}
// The API server's port during `npm run dev` (Vite serves the client and forwards /api to it).
const apiPort = Number(process.env.LOUDHOUR_API_PORT ?? 3000)

export default defineConfig({
  plugins: [vue()],
  define: { __APP_VERSION__: JSON.stringify(packageJson.version) },
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    chunkSizeWarningLimit: 900,
  },
  server: {
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
})
