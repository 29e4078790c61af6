import { Router } from 'express'
import { rateLimit } from 'express-rate-limit'
import { estimate } from '../../shared/engine'
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import { ApiError, parseInput } from '../http/errors'

// Pure computation, open to all: a per-address limit keeps one client from taking both cores.
const requestsPerMinute = 120

export function estimateRouter(): Router {
  const router = Router()
  router.use(
    rateLimit({
      windowMs: 60_000,
      limit: requestsPerMinute,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next, options) =>
        next(
          new ApiError(
            429,
            'throttled',
            'Too many estimates from this address; wait a minute.',
            undefined,
            {
              'Retry-After': String(Math.ceil(options.windowMs / 1000)),
            },
          ),
        ),
    }),
  )
  router.post('/', (req, res) => {
    const request = parseInput(estimateRequestSchema, req.body)
    res.json(estimate(request))
  })
  return router
}
