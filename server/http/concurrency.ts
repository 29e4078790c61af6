import type { Request, RequestHandler } from 'express'
import { ApiError } from './errors'

export interface ConcurrencyOptions {
  /** Requests of one key allowed in progress at once. */
  limit: number
  key: (req: Request) => string | undefined
  message: string
  retryAfterS: number
}

/**
 * Refuses (429) a request while `limit` others with the same key are still in progress: one
 * account cannot take every upload slot. The slot is freed when the answer is sent or the
 * connection closes, whichever comes first.
 */
export function limitConcurrent(options: ConcurrencyOptions): RequestHandler {
  const inProgress = new Map<string, number>()
  return (req, res, next) => {
    const key = options.key(req)
    if (key === undefined) return next()
    const running = inProgress.get(key) ?? 0
    if (running >= options.limit) {
      throw new ApiError(429, 'throttled', options.message, undefined, {
        'Retry-After': String(options.retryAfterS),
      })
    }
    inProgress.set(key, running + 1)
    res.once('close', () => {
      const left = (inProgress.get(key) ?? 1) - 1
      if (left <= 0) inProgress.delete(key)
      else inProgress.set(key, left)
    })
    next()
  }
}
