import { fileURLToPath, URL } from 'node:url'
import { readFileSync } from 'node:fs'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import { VitePWA } from 'vite-plugin-pwa'
import { OFFLINE_API_CACHE } from './shared/offline.ts'

const packageJson = JSON.parse(
  readFileSync(new URL('./package.json', import.meta.url), 'utf8'),
) as {
  version: string
}
// The API server's port during `npm run dev` (Vite serves the client and forwards /api to it).
const apiPort = Number(process.env.LOUDHOUR_API_PORT ?? 3000)

export default defineConfig({
  plugins: [
    vue(),
    // Offline in the field: a service worker keeps the built app, and the API's answers as last
    // loaded, so an open plan, its card and the bench still load without a network. The API's
    // cache is emptied when a session ends (src/offline/apiCache.ts).
    VitePWA({
      registerType: 'autoUpdate',
      injectRegister: 'script',
      manifest: false,
      workbox: {
        globPatterns: ['**/*.{js,css,html,woff2,svg}'],
        // The password checker's word lists load only when a new password is typed.
        globIgnores: ['**/password-strength-*.js'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//],
        cleanupOutdatedCaches: true,
        // A new version takes over open pages at once: after a deploy the server holds only the
        // new files anyway.
        skipWaiting: true,
        clientsClaim: true,
        runtimeCaching: [
          {
            // Network first: online, every answer is fresh; offline, the last one is shown.
            urlPattern: ({ url, request }) =>
              request.method === 'GET' && url.pathname.startsWith('/api/v1/'),
            handler: 'NetworkFirst',
            options: {
              cacheName: OFFLINE_API_CACHE,
              networkTimeoutSeconds: 5,
              expiration: { maxEntries: 200, maxAgeSeconds: 14 * 24 * 3600 },
              cacheableResponse: { statuses: [200] },
            },
          },
        ],
      },
    }),
  ],
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
