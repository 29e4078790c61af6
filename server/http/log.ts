import type { IncomingMessage, ServerResponse } from 'node:http'
import type { Request, RequestHandler } from 'express'
import { pino, type DestinationStream, type Level, type Logger } from 'pino'
import { pinoHttp } from 'pino-http'

/*
 * The operator's log: one JSON object a line on stdout (pino). Every request is one line with
 * its method, path, status, time, client address and account; security events are lines of
 * their own with `event` set. No header, cookie, body, query string or link token is ever
 * written: the serializers below keep only what is named, and `redact` censors the usual secret
 * names in any fields a caller passes.
 */

export type { Logger }

// OWASP Logging Cheat Sheet: never log passwords, session identifiers or access tokens.
const redactedPaths = [
  'password',
  'currentPassword',
  'newPassword',
  'token',
  'cookie',
  'authorization',
  '*.password',
  '*.currentPassword',
  '*.newPassword',
  '*.token',
  '*.cookie',
  '*.authorization',
  'req.headers',
  'res.headers',
  'req.body',
]

export function createLogger(level: string, destination?: DestinationStream): Logger {
  const options = {
    level,
    base: { service: 'loudhour' },
    redact: { paths: redactedPaths, censor: '[redacted]' },
    timestamp: pino.stdTimeFunctions.isoTime,
  }
  return destination ? pino(options, destination) : pino(options)
}

// A shared card's path holds its link token: the log shows which route, not which card.
const tokenInPath = /^(\/api\/v1\/shared\/)[^/]+/

/** The path without its query string (which may carry search text) or a link token. */
export function loggedPath(url: string): string {
  const path = url.split('?')[0] ?? ''
  return path.replace(tokenInPath, '$1[token]')
}

/** The account behind the request, once `authenticate` has run. */
const accountIdOf = (req: IncomingMessage) => (req as Request).auth?.user.id

function levelOf(req: IncomingMessage, res: ServerResponse, error?: Error): Level | 'silent' {
  if (error || res.statusCode >= 500) return 'error'
  const path = (req as Request).originalUrl ?? req.url ?? ''
  // The app's files and the health probe would drown the API's lines.
  if (!path.startsWith('/api/') || path.startsWith('/api/health')) return 'debug'
  return 'info'
}

/** One line per finished request (pino-http), and `req.log` for the handlers' events. */
export function requestLog(logger: Logger): RequestHandler {
  return pinoHttp({
    logger,
    quietReqLogger: true,
    customLogLevel: levelOf,
    // Only once the answer is sent (pino-http also asks at the start, before the session is
    // read; answering both times would write the address twice).
    customProps: (req, res) =>
      res.writableEnded ? { ip: (req as Request).ip, accountId: accountIdOf(req) } : {},
    serializers: {
      req: (req: { method?: string; url?: string; raw?: IncomingMessage }) => ({
        method: req.method,
        path: loggedPath((req.raw as Request | undefined)?.originalUrl ?? req.url ?? ''),
      }),
      res: (res: { statusCode?: number }) => ({ status: res.statusCode }),
    },
  }) as RequestHandler
}

/** The names of the events an operator may filter on; add new ones here. */
export type SecurityEventName =
  | 'sign-up'
  | 'sign-in-failed'
  | 'request-refused'
  | 'password-changed'
  | 'password-reset-requested'
  | 'password-reset-completed'
  | 'email-verification-resent'
  | 'email-verified'
  | 'role-changed'
  | 'member-removed'
  | 'invitation-sent'
  | 'invitation-accepted'
  | 'discharge-log-uploaded'

type EventFields = Record<string, string | number | boolean | null | undefined>

/**
 * Logs a security event the one way: its name, the client address (as `trust proxy` yields it)
 * and the signed-in account unless `fields.accountId` names the account concerned. Never pass a
 * password, token, cookie or body; the logger censors the common names anyway.
 */
export function securityEvent(req: Request, name: SecurityEventName, fields: EventFields = {}) {
  const level = name === 'request-refused' || name === 'sign-in-failed' ? 'warn' : 'info'
  req.log?.[level]({ event: name, ip: req.ip, accountId: accountIdOf(req), ...fields }, name)
}
