import { Router } from 'express'
import type { Queryable } from '../db/queryable'
import { events } from '../db/schema-events'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import { minuteMs, throttle } from '../http/throttle'
import { parseInput } from '../http/errors'
import {
  answerFor,
  checkEventPlans,
  eventPlanIds,
  replaceEventPlans,
  type EventRow,
} from '../events/event-plans'
import type { ResourceContext, ResourceDefinition } from '../resources/resource-definition'
import { teamResourceRouter } from '../resources/team-resource-router'
import { eventSummary } from '../../shared/events/run-event'
import {
  eventBodySchema,
  eventPreviewSchema,
  eventUpdateSchema,
  type EventBody,
  type EventItem,
} from '../../shared/schemas/events'

function bodyOf(tx: Queryable, row: EventRow): EventBody {
  return {
    name: row.name,
    notes: row.notes,
    date: row.date,
    planIds: eventPlanIds(tx, row.id),
    pool: row.pool,
    chargers: row.chargers,
  }
}

/** Events: `/api/v1/teams/:teamId/events`. The answer is computed from the plans when read. */
export const eventDefinition: ResourceDefinition<typeof events, EventBody, EventItem> = {
  table: events,
  noun: 'event',
  idParam: 'eventId',
  createSchema: eventBodySchema,
  updateSchema: eventUpdateSchema,
  columns: (body) => ({ date: body.date, pool: body.pool, chargers: body.chargers }),
  checkBody: ({ tx, teamId }, body) => checkEventPlans(tx, teamId, body.planIds),
  afterWrite: ({ tx }, eventId, body) => replaceEventPlans(tx, eventId, body.planIds),
  bodyOf,
  toItem: (tx, row, meta) => {
    const body = bodyOf(tx, row)
    const answer = answerFor(tx, row.teamId, body)
    return {
      ...meta,
      date: row.date,
      planIds: body.planIds,
      pool: row.pool,
      chargers: row.chargers,
      summary: eventSummary(answer),
      answer,
    }
  },
}

export function eventsRouter(context: ResourceContext): Router {
  const router = Router({ mergeParams: true })
  // The answer for an unsaved body, while the crew edits; nothing is written.
  // Each preview runs the engine for every plan, so one account may ask only so often.
  const previewThrottle = throttle({
    name: 'event_preview',
    windowMs: minuteMs,
    // Ours: a crew lead typing in the form asks a few times a minute.
    limit: 120,
    key: (req) => String(signedInUser(req).user.id),
    message: 'Too many event previews from this account. Wait a minute and try again.',
  })
  router.post('/preview', requireTeamRole('viewer'), previewThrottle, (req, res) => {
    const body = parseInput(eventPreviewSchema, req.body)
    res.json(answerFor(context.db, teamMembership(req).teamId, body))
  })
  router.use(teamResourceRouter(context, eventDefinition))
  return router
}
