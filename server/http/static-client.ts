import { existsSync } from 'node:fs'
import { join } from 'node:path'
import express, { type Router } from 'express'

/**
 * Serves the built client from dist/ with a history fallback, so a deep link such as /plans/123
 * loads the app and the client router takes over. Hashed assets are cached for a year.
 */
export function staticClient(distDir: string): Router | undefined {
  const indexFile = join(distDir, 'index.html')
  if (!existsSync(indexFile)) return undefined
  const router = express.Router()
  router.use(
    '/assets',
    express.static(join(distDir, 'assets'), {
      immutable: true,
      maxAge: '365d',
      fallthrough: false,
    }),
  )
  router.use(
    express.static(distDir, {
      index: false,
      maxAge: '1h',
      // The service worker and its loader are checked on every visit, so an update reaches
      // the field at the next load.
      setHeaders: (res, path) => {
        if (/[\\/](sw|registerSW)\.js$/.test(path)) res.setHeader('Cache-Control', 'no-cache')
      },
    }),
  )
  router.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/')) return next()
    res.setHeader('Cache-Control', 'no-cache')
    res.sendFile(indexFile)
  })
  return router
}
