import { fileURLToPath } from 'node:url'
import express, { type Express } from 'express'
import helmet from 'helmet'
import type { DatabaseHandle } from './db/client'
import type { Env } from './env'
import { apiNotFound, errorHandler } from './http/errors'
import { staticClient } from './http/static-client'
import { healthRouter } from './routes/health'
import { estimateRouter } from './routes/estimate'

export interface AppDependencies {
  env: Env
  database: DatabaseHandle
  /** Signs session tokens (≥ 32 bytes; see secret.ts). */
  sessionSecret: string
  /** Where the built client lives; tests leave it out and get the API alone. */
  distDir?: string
  log?: (error: unknown) => void
}

export const defaultDistDir = fileURLToPath(new URL('../dist', import.meta.url))

// JSON bodies above this are refused with 413: the largest real body (a rig with a long day's
// schedule) is a few kilobytes.
const jsonBodyLimit = '256kb'

/** Builds the whole HTTP application from its dependencies; `index.ts` only makes it listen. */
export function createApp(deps: AppDependencies): Express {
  const { env, database } = deps
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', false)
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          // naive-ui writes its component styles into <style> elements at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'base-uri': ["'self'"],
          'form-action': ["'self'"],
          'upgrade-insecure-requests': env.PUBLIC_URL.startsWith('https:') ? [] : null,
        },
      },
      strictTransportSecurity: env.PUBLIC_URL.startsWith('https:'),
    }),
  )

  const api = express.Router()
  api.use(express.json({ limit: jsonBodyLimit }))
  api.use('/health', healthRouter(database))
  api.use('/v1/estimate', estimateRouter())
  api.use(apiNotFound)
  app.use('/api', api)

  const client = staticClient(deps.distDir ?? defaultDistDir)
  if (client && env.NODE_ENV !== 'development') app.use(client)

  app.use(
    errorHandler({
      exposeStack: env.NODE_ENV === 'development',
      log: deps.log ?? ((error) => console.error(error)),
    }),
  )
  return app
}
