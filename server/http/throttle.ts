import type { Request, RequestHandler } from 'express'
import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import { slowDown } from 'express-slow-down'
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

/** The client's address as the limiters count it: IPv6 clients per /56, so one host cannot
 * rotate through its own addresses. */
export function addressKey(req: Request): string {
  return ipKeyGenerator(req.ip ?? 'unknown')
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
    keyGenerator: (req) => (keyOf === 'address' ? addressKey(req) : (keyOf(req) ?? '')),
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

export interface DelayOptions {
  name: string
  windowMs: number
  /** Failures in the window answered at full speed. */
  freeFailures: number
  /** Added per failure beyond the free ones. */
  stepMs: number
  maxDelayMs: number
  key: (req: Request) => string | undefined
}

/**
 * Slows, never refuses: once a key has more failures than `freeFailures` in the window, each
 * request for it waits `stepMs` more per failure, up to `maxDelayMs`. A success takes its own
 * count back. For counters an attacker can run up against someone else (OWASP Authentication
 * Cheat Sheet: prefer delays to lockouts, which lock out the owner too).
 */
export function delayAfterFailures(options: DelayOptions): RequestHandler {
  const keyOf = options.key
  return slowDown({
    windowMs: options.windowMs,
    delayAfter: options.freeFailures,
    delayMs: (used) => (used - options.freeFailures) * options.stepMs,
    maxDelayMs: options.maxDelayMs,
    requestPropertyName: `delay_${options.name}`,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => keyOf(req) ?? '',
    skip: (req) => keyOf(req) === undefined,
  })
}
