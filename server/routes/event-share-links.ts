import { Router, type Request } from 'express'
import { and, eq } from 'drizzle-orm'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import type { AccountsContext } from '../auth/context'
import type { Queryable } from '../db/queryable'
import { events } from '../db/schema-events'
import { ApiError, parseInput } from '../http/errors'
import { rowIdParam } from '../http/params'
import { eventLinks } from '../events/event-share-links'
import { shareLinkBodySchema } from '../../shared/card/schemas'

/*
 * Read-only links to an event's card, at `/api/v1/teams/:teamId/events/:eventId/share-links`:
 *
 *   GET    /          viewer  → { items }: the links that still work, newest first (no tokens)
 *   POST   /          editor  { label?, expiresAt? } → 201 { id, url, ... }: the only time the url is shown
 *   DELETE /:eventLinkId   editor  → 204; the link answers 404 from then on
 */

const noSuchEvent = 'No such event in this team.'

/** The team's event from the path, or 404 (another team's event is as unknown as none). */
function requireTeamEvent(db: Queryable, req: Request): { id: number; date: string } {
  const eventId = rowIdParam(req, 'eventId', noSuchEvent)
  const found = db
    .select({ id: events.id, date: events.date })
    .from(events)
    .where(and(eq(events.id, eventId), eq(events.teamId, teamMembership(req).teamId)))
    .get()
  if (!found) throw new ApiError(404, 'not-found', noSuchEvent)
  return found
}

const requireTeamEventId = (db: Queryable, req: Request): number => requireTeamEvent(db, req).id

export function eventShareLinksRouter(
  context: Pick<AccountsContext, 'db' | 'clock' | 'publicUrl'>,
): Router {
  const { db, clock, publicUrl } = context
  const router = Router({ mergeParams: true })

  router.get('/', requireTeamRole('viewer'), (req, res) => {
    res.json({ items: eventLinks.live(db, requireTeamEventId(db, req), clock().getTime()) })
  })

  router.post('/', requireTeamRole('editor'), (req, res) => {
    const body = parseInput(shareLinkBodySchema, req.body ?? {})
    const created = db.transaction((tx) => {
      const event = requireTeamEvent(tx, req)
      return eventLinks.create(
        {
          tx,
          ownerId: event.id,
          userId: signedInUser(req).user.id,
          nowMs: clock().getTime(),
          publicUrl,
          eventDate: event.date,
        },
        body,
      )
    })
    res.status(201).json(created)
  })

  router.delete('/:eventLinkId', requireTeamRole('editor'), (req, res) => {
    const linkId = rowIdParam(req, 'eventLinkId', 'No such share link on this event.')
    const revoked = db.transaction((tx) =>
      eventLinks.revoke(tx, requireTeamEventId(tx, req), linkId, clock().getTime()),
    )
    if (!revoked) throw new ApiError(404, 'not-found', 'No such share link on this event.')
    res.status(204).end()
  })

  return router
}
