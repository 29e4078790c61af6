import { Router } from 'express'
import { eq } from 'drizzle-orm'
import { plans } from '../db/schema-resources'
import { SHARE_TOKEN_PATTERN, notShared, sharedCardThrottle } from '../card/shared-card-guard'
import type { ResourceContext } from '../resources/resource-definition'
import { planCard } from '../card/plan-card'
import { findLiveShareLink } from '../card/share-links'
import type { SharedCardResponse } from '../../shared/card/schemas'

/**
 * `GET /api/v1/shared/:token`: a plan's card for anyone with the link, signed in or not. It
 * answers with the card alone (no ids, team or people), and the same 404 for every dead link.
 */
export function sharedRouter(context: ResourceContext): Router {
  const { db, clock } = context
  const router = Router()
  router.get('/:token', sharedCardThrottle('shared_card'), (req, res) => {
    res.setHeader('Cache-Control', 'no-store')
    res.setHeader('X-Robots-Tag', 'noindex')
    const token = req.params.token
    if (typeof token !== 'string' || !SHARE_TOKEN_PATTERN.test(token)) throw notShared()
    const link = findLiveShareLink(db, token, clock().getTime())
    const plan = link && db.select().from(plans).where(eq(plans.id, link.planId)).get()
    if (!link || !plan) throw notShared()
    const answer: SharedCardResponse = {
      card: planCard(db, plan),
      expiresAt: link.expiresAtMs === null ? null : new Date(link.expiresAtMs).toISOString(),
    }
    res.json(answer)
  })
  return router
}
