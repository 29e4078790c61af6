import { fileURLToPath, URL } from 'node:url'
import { readFileSync } from 'node:fs'
import { defineConfig } from 'vite'
import vue from '@vitejs/plugin-vue'
import { VitePWA } from 'vite-plugin-pwa'
import {
  OFFLINE_API_CACHE,
  OFFLINE_NEVER_KEPT_API_PREFIXES,
  OFFLINE_PUBLIC_API_PREFIXES,
} from './shared/offline.ts'

const packageJson = JSON.parse(
  readFileSync(new URL('./package.json', import.meta.url), 'utf8'),
) as {
  version: string
}
// The API server's port during `npm run dev` (Vite serves the client and forwards /api to it).
const apiPort = Number(process.env.LOUDHOUR_API_PORT ?? 3000)

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')

// The API answers the service worker keeps (GET only, workbox's default): everything under
// /api/v1/ but the mail catcher.
const keptApiAnswers = new RegExp(
  `^https?://[^/]+/api/v1/(?!${OFFLINE_NEVER_KEPT_API_PREFIXES.map((prefix) => escapeRegExp(prefix.slice('/api/v1/'.length))).join('|')})`,
)

// A 401 means the session ended, perhaps on another device ("sign out everywhere", a password
// change): the account's kept answers go at once, before any page asks. workbox-build copies
// this function's source into the service worker, so it is built from text holding only
// literals (no names from this file survive the copy).
const AsyncFunction = Object.getPrototypeOf(async () => {}).constructor as new (
  ...args: string[]
) => (param: { response: Response }) => Promise<Response>
const forgetAccountAnswersOn401 = new AsyncFunction(
  '{ response }',
  // Semicolons throughout: the copy joins the lines into one.
  `if (response.status === 401) {
    const cache = await caches.open(${JSON.stringify(OFFLINE_API_CACHE)});
    const publicPrefixes = ${JSON.stringify(OFFLINE_PUBLIC_API_PREFIXES)};
    for (const request of await cache.keys()) {
      const path = new URL(request.url).pathname;
      if (!publicPrefixes.some((prefix) => path.startsWith(prefix))) await cache.delete(request);
    }
  }
  return response;`,
)

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
            urlPattern: keptApiAnswers,
            handler: 'NetworkFirst',
            options: {
              plugins: [{ fetchDidSucceed: forgetAccountAnswersOn401 }],
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
    // `@/` is the client's own code, `@shared/` the pure domain code it shares with the server.
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
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
