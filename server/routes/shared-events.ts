import { Router } from 'express'
import { eq } from 'drizzle-orm'
import { events } from '../db/schema-events'
import { SHARE_TOKEN_PATTERN, notShared, sharedCardThrottle } from '../card/shared-card-guard'
import type { ResourceContext } from '../resources/resource-definition'
import { answerFor, eventPlanIds } from '../events/event-plans'
import { eventLinks } from '../events/event-share-links'
import { eventCardOf, type SharedEventCardResponse } from '../../shared/schemas/events'

/**
 * `GET /api/v1/shared/events/:token`: an event's card for anyone with the link. It answers with
 * the card alone (no ids, team or people), and the same 404 for every dead link.
 */
export function sharedEventsRouter(context: ResourceContext): Router {
  const { db, clock } = context
  const router = Router()
  router.get('/:eventToken', sharedCardThrottle('shared_event_card'), (req, res) => {
    res.setHeader('Cache-Control', 'no-store')
    res.setHeader('X-Robots-Tag', 'noindex')
    const token = req.params.eventToken
    if (typeof token !== 'string' || !SHARE_TOKEN_PATTERN.test(token)) throw notShared()
    const link = eventLinks.findLive(db, token, clock().getTime())
    const event = link && db.select().from(events).where(eq(events.id, link.eventId)).get()
    if (!link || !event) throw notShared()
    const answer = answerFor(db, event.teamId, {
      planIds: eventPlanIds(db, event.id),
      pool: event.pool,
      chargers: event.chargers,
    })
    const body: SharedEventCardResponse = {
      card: eventCardOf({ ...event, answer }),
      expiresAt: link.expiresAtMs === null ? null : new Date(link.expiresAtMs).toISOString(),
    }
    res.json(body)
  })
  return router
}
