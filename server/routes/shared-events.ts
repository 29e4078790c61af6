import { Router } from 'express'
import { eq } from 'drizzle-orm'
import { events } from '../db/schema-events'
import { ApiError } from '../http/errors'
import { minuteMs, throttle } from '../http/throttle'
import type { ResourceContext } from '../resources/resource-definition'
import { answerFor, eventPlanIds } from '../events/event-plans'
import { findLiveEventShareLink } from '../events/event-share-links'
import { eventCardOf, type SharedEventCardResponse } from '../../shared/schemas/events'

// Tokens are 32 random bytes in base64url (auth/link-tokens.ts): anything else names no link.
const tokenPattern = /^[A-Za-z0-9_-]{43}$/

const notShared = () =>
  new ApiError(
    404,
    'not-found',
    'This card link does not work: it was revoked, has expired, or was never made. Ask the crew for a new one.',
  )

/**
 * `GET /api/v1/shared/events/:token`: an event's card for anyone with the link. It answers with
 * the card alone (no ids, team or people), and the same 404 for every dead link.
 */
export function sharedEventsRouter(context: ResourceContext): Router {
  const { db, clock } = context
  const router = Router()
  router.get(
    '/:eventToken',
    throttle({
      name: 'shared_event_card',
      windowMs: minuteMs,
      // Ours: as for a plan's shared card; each answer runs the engine for every plan.
      limit: 60,
      key: 'address',
      message: 'Too many card requests from this address. Wait a minute and try again.',
    }),
    (req, res) => {
      res.setHeader('Cache-Control', 'no-store')
      res.setHeader('X-Robots-Tag', 'noindex')
      const token = req.params.eventToken
      if (typeof token !== 'string' || !tokenPattern.test(token)) throw notShared()
      const link = findLiveEventShareLink(db, token, clock().getTime())
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
    },
  )
  return router
}
