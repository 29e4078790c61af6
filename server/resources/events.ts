import type { Queryable } from '../db/queryable'
import { events } from '../db/schema-events'
import {
  answerFor,
  checkEventPlans,
  eventPlanIds,
  replaceEventPlans,
  type EventRow,
} from '../events/event-plans'
import { storeEventSummary } from '../events/event-summaries'
import { ownedRowsOf } from './owned-table'
import type { ResourceDefinition } from './resource-definition'
import { eventSummary } from '../../shared/events/run-event'
import {
  eventBodySchema,
  eventUpdateSchema,
  type EventBody,
  type EventItem,
  type EventListItem,
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

/**
 * Events: `/api/v1/teams/:teamId/events`. One event's answer is worked out from its plans when
 * read; the list shows the summary stored at the last save (server/events/event-summaries.ts).
 */
export const eventDefinition: ResourceDefinition<
  typeof events,
  EventBody,
  EventItem,
  EventListItem
> = {
  rows: ownedRowsOf(events),
  noun: 'event',
  idParam: 'eventId',
  createSchema: eventBodySchema,
  updateSchema: eventUpdateSchema,
  values: (body, owned) => ({
    ...owned,
    date: body.date,
    pool: body.pool,
    chargers: body.chargers,
  }),
  checkBody: ({ tx, teamId }, body) => checkEventPlans(tx, teamId, body.planIds),
  afterWrite: ({ tx, teamId }, eventId, body) => {
    replaceEventPlans(tx, eventId, body.planIds)
    storeEventSummary(tx, { id: eventId, teamId, pool: body.pool, chargers: body.chargers })
  },
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
  toListItem: (tx, row, meta) => ({
    ...meta,
    date: row.date,
    planIds: eventPlanIds(tx, row.id),
    pool: row.pool,
    chargers: row.chargers,
    summary: row.summary ?? null,
  }),
}
