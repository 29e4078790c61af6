import { Router } from 'express'
import { compareForApi } from '../../shared/engine/compare'
import { compareRequestSchema } from '../../shared/schemas/compare'
import { parseInput } from '../http/errors'
import { minuteMs, throttle } from '../http/throttle'

// Pure computation, open to all, like the estimate. One comparison runs up to 60 estimates (60 take
// most of a second), so a tighter per-address limit than the estimate's keeps one client from
// taking both cores.
const comparisonsPerMinute = 10

/** `POST /api/v1/compare`: `{ rig, packs }` → `{ rows }` in the order given (docs/estimate-api.md). */
export function compareRouter(): Router {
  const router = Router()
  router.use(
    throttle({
      name: 'compare',
      windowMs: minuteMs,
      limit: comparisonsPerMinute,
      key: 'address',
      message: 'Too many pack comparisons from this address; wait a minute.',
    }),
  )
  router.post('/', (req, res) => {
    res.json(compareForApi(parseInput(compareRequestSchema, req.body)))
  })
  return router
}
