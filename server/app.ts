import { fileURLToPath } from 'node:url'
import express, { type Express } from 'express'
import helmet from 'helmet'
import cookieParser from 'cookie-parser'
import { authenticate } from './auth/authenticate'
import type { AccountsContext } from './auth/context'
import { sessionCookie } from './auth/session-cookie'
import { createSessionStore } from './auth/sessions'
import { systemClock, type Clock } from './clock'
import type { Mailer } from './mail/mailer'
import type { DatabaseHandle } from './db/client'
import type { Env } from './env'
import { apiNotFound, errorHandler } from './http/errors'
import { createLogger, requestLog, type Logger } from './http/log'
import { noStore } from './http/no-store'
import { staticClient } from './http/static-client'
import { healthRouter } from './routes/health'
import { estimateRouter } from './routes/estimate'
import { authRouter } from './routes/auth'
import { teamsRouter } from './routes/teams'
import { invitationsRouter } from './routes/invitations'
import { outboxRouter } from './routes/outbox'
import { sameOrigin } from './http/same-origin'
import { libraryRouter } from './routes/library'
import { teamResourcesRouter } from './routes/team-resources'
import { sharedRouter } from './routes/shared'

export interface AppDependencies {
  env: Env
  database: DatabaseHandle
  /** Signs session tokens (≥ 32 bytes; see secret.ts). */
  sessionSecret: string
  /** Sends invitations and reset links; see mail/mailer.ts (createMailer). */
  mail: Mailer
  /** The current time; tests pass a fake one to step past expiry. */
  clock?: Clock
  /** Where the built client lives; tests leave it out and get the API alone. */
  distDir?: string
  /** The request and event log; by default pino on stdout at LOG_LEVEL. */
  logger?: Logger
  /** Where unexpected errors (500s) go; by default the logger. */
  log?: (error: unknown) => void
}

export const defaultDistDir = fileURLToPath(new URL('../dist', import.meta.url))

// JSON bodies above this are refused with 413: the largest real body (a rig with a long day's
// schedule) is a few kilobytes.
const jsonBodyLimit = '256kb'

/** Builds the whole HTTP application from its dependencies; `index.ts` only makes it listen. */
export function createApp(deps: AppDependencies): Express {
  const { env, database, mail } = deps
  const logger = deps.logger ?? createLogger(env.LOG_LEVEL)
  const log = deps.log ?? ((error: unknown) => logger.error({ err: error }, 'unexpected error'))
  const clock = deps.clock ?? systemClock
  const accounts: AccountsContext = {
    db: database.db,
    publicUrl: env.PUBLIC_URL,
    clock,
    sessions: createSessionStore(database.db, deps.sessionSecret, clock),
    cookie: sessionCookie(env.PUBLIC_URL),
    mail,
    log,
  }
  const app = express()
  app.disable('x-powered-by')
  // req.ip (rate limits, logs) is the client behind the proxies TRUST_PROXY names, if any.
  app.set('trust proxy', env.TRUST_PROXY)
  app.use(requestLog(logger))
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
  api.use(noStore)
  // Before anything that could change state: cross-site writes stop here (see same-origin.ts).
  api.use(sameOrigin(env.PUBLIC_URL))
  api.use(express.json({ limit: jsonBodyLimit }))
  api.use(cookieParser())
  api.use(authenticate(accounts.db, accounts.sessions, accounts.cookie))
  api.use('/health', healthRouter(database))
  api.use('/v1/estimate', estimateRouter())
  api.use('/v1/auth', authRouter(accounts))
  api.use('/v1/teams', teamsRouter(accounts))
  api.use('/v1/teams/:teamId', teamResourcesRouter(accounts))
  api.use('/v1/invitations', invitationsRouter(accounts))
  if (mail.outbox) api.use('/v1/dev/outbox', outboxRouter(database.db, mail.outbox))
  api.use('/v1/library', libraryRouter())
  api.use('/v1/shared', sharedRouter(accounts))
  api.use(apiNotFound)
  app.use('/api', api)

  const client = staticClient(deps.distDir ?? defaultDistDir)
  if (client && env.NODE_ENV !== 'development') app.use(client)

  app.use(
    errorHandler({
      exposeStack: env.NODE_ENV === 'development',
      log,
    }),
  )
  return app
}
