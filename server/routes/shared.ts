import { Router } from 'express'
import { eq } from 'drizzle-orm'
import { plans } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import { minuteMs, throttle } from '../http/throttle'
import type { ResourceContext } from '../resources/resource-definition'
import { planCard } from '../card/plan-card'
import { findLiveShareLink } from '../card/share-links'
import type { SharedCardResponse } from '../../shared/card/schemas'

// Tokens are 32 random bytes in base64url (auth/link-tokens.ts): anything else names no link.
const tokenPattern = /^[A-Za-z0-9_-]{43}$/

const notShared = () =>
  new ApiError(
    404,
    'not-found',
    'This card link does not work: it was revoked, has expired, or was never made. Ask the crew for a new one.',
  )

/**
 * `GET /api/v1/shared/:token`: a plan's card for anyone with the link, signed in or not. It
 * answers with the card alone (no ids, team or people), and the same 404 for every dead link.
 */
export function sharedRouter(context: ResourceContext): Router {
  const { db, clock } = context
  const router = Router()
  router.get(
    '/:token',
    throttle({
      name: 'shared_card',
      windowMs: minuteMs,
      // Ours: a volunteer reloading on a phone stays far below it; guessing tokens gets nowhere.
      limit: 60,
      key: 'address',
      message: 'Too many card requests from this address. Wait a minute and try again.',
    }),
    (req, res) => {
      res.setHeader('Cache-Control', 'no-store')
      res.setHeader('X-Robots-Tag', 'noindex')
      const token = req.params.token
      if (typeof token !== 'string' || !tokenPattern.test(token)) throw notShared()
      const link = findLiveShareLink(db, token, clock().getTime())
      const plan = link && db.select().from(plans).where(eq(plans.id, link.planId)).get()
      if (!link || !plan) throw notShared()
      const answer: SharedCardResponse = {
        card: planCard(db, plan),
        expiresAt: link.expiresAtMs === null ? null : new Date(link.expiresAtMs).toISOString(),
      }
      res.json(answer)
    },
  )
  return router
}
