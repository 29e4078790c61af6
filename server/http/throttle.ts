import type { Request, RequestHandler } from 'express'
import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import { ApiError } from './errors'

export const minuteMs = 60 * 1000
export const hourMs = 60 * minuteMs

export interface ThrottleOptions {
  /** Distinguishes this limiter's counters and its `req` property from others on the same route. */
  name: string
  windowMs: number
  limit: number
  /** The counter a request counts against; undefined lets the request through uncounted. */
  key: 'address' | ((req: Request) => string | undefined)
  /** Count only refused attempts (a correct password does not use up the allowance). */
  countFailuresOnly?: boolean
  message: string
}

/** A per-process limiter answering 429 with Retry-After through the API's one error shape. */
export function throttle(options: ThrottleOptions): RequestHandler {
  const propertyName = `throttle_${options.name}`
  const keyOf = options.key
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    requestPropertyName: propertyName,
    skipSuccessfulRequests: options.countFailuresOnly ?? false,
    // IPv6 clients are counted per /56 so one host cannot rotate through its own addresses.
    keyGenerator: (req) =>
      keyOf === 'address' ? ipKeyGenerator(req.ip ?? 'unknown') : (keyOf(req) ?? ''),
    skip: (req) => keyOf !== 'address' && keyOf(req) === undefined,
    handler: (req, _res, next) => {
      const info = (req as unknown as Record<string, { resetTime?: Date } | undefined>)[
        propertyName
      ]
      const waitMs = info?.resetTime ? info.resetTime.getTime() - Date.now() : options.windowMs
      const retryAfterS = Math.max(1, Math.ceil(waitMs / 1000))
      next(
        new ApiError(429, 'throttled', options.message, undefined, {
          'Retry-After': String(retryAfterS),
        }),
      )
    },
  })
}
