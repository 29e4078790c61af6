import type { Queryable } from '../db/queryable'
import { events } from '../db/schema-events'
import {
  answerFor,
  checkEventPlans,
  eventPlanIds,
  replaceEventPlans,
  type EventRow,
} from '../events/event-plans'
import { ownedRowsOf } from './owned-table'
import type { ResourceDefinition } from './resource-definition'
import { eventSummary } from '../../shared/events/run-event'
import {
  eventBodySchema,
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
