import { eq, inArray } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { eventPlans, events } from '../db/schema-events'
import { answerFor, eventPlanIds, type EventRow } from './event-plans'
import { eventSummary } from '../../shared/events/run-event'

// An event's list summary is stored, so the list reads rows and runs no engine. It is worked out
// again, inside the writing transaction, whenever something it depends on is saved: the event,
// one of its plans, or a rig (or a pack's health) under one of those plans; and at start when the
// engine's version changed (server/db/recompute-summaries.ts).

type EventInputs = Pick<EventRow, 'id' | 'teamId' | 'pool' | 'chargers'>

/** Works the event's answer out from its plans and rigs as saved now, and stores its summary. */
export function storeEventSummary(tx: Queryable, event: EventInputs): void {
  const answer = answerFor(tx, event.teamId, {
    planIds: eventPlanIds(tx, event.id),
    pool: event.pool,
    chargers: event.chargers,
  })
  const summary = eventSummary(answer)
  tx.update(events)
    .set({ summary, summaryEngineVersion: summary.engineVersion })
    .where(eq(events.id, event.id))
    .run()
}

/** Stores again the summary of every event that uses one of these plans; returns how many. */
export function recomputeEventsOfPlans(tx: Queryable, planIds: readonly number[]): number {
  if (planIds.length === 0) return 0
  const using = tx
    .selectDistinct({ eventId: eventPlans.eventId })
    .from(eventPlans)
    .where(inArray(eventPlans.planId, [...planIds]))
    .all()
    .map((row) => row.eventId)
  if (using.length === 0) return 0
  const rows = tx.select().from(events).where(inArray(events.id, using)).all()
  for (const row of rows) storeEventSummary(tx, row)
  return rows.length
}
