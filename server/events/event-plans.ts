import { and, asc, eq, inArray } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { eventPlans, events } from '../db/schema-events'
import { plans, rigs } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import { runEvent, type EventPlanInput } from '../../shared/events/run-event'
import { planEstimateRequest } from '../../shared/plans/request'
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import type { EventAnswer, EventBody } from '../../shared/schemas/events'

// An event's plans as the engine runs them, and the answer for the event as it is now. The
// answer is computed when it is read, so it always follows the plans' and rigs' latest saves.

export type EventRow = typeof events.$inferSelect

interface PlanOfEvent {
  input: EventPlanInput | null
  planId: number
  planName: string
}

/** The team's plans with these ids, in the order given; a 400 names the first id not found. */
function teamPlans(tx: Queryable, teamId: number, planIds: readonly number[]): PlanOfEvent[] {
  if (planIds.length === 0) return []
  const rows = tx
    .select({ plan: plans, rigName: rigs.name, rigSpec: rigs.spec })
    .from(plans)
    .innerJoin(rigs, eq(rigs.id, plans.rigId))
    .where(and(eq(plans.teamId, teamId), inArray(plans.id, [...planIds])))
    .all()
  return planIds.map((planId, index) => {
    const found = rows.find((row) => row.plan.id === planId)
    if (!found) {
      const message = `No plan with id ${planId} in this team`
      throw new ApiError(
        400,
        'invalid-input',
        `The request body is not valid. planIds.${index}: ${message}`,
        [{ path: `planIds.${index}`, message }],
      )
    }
    // A plan whose rig no longer passes the schema (after an engine change) cannot run.
    const parsed = estimateRequestSchema.safeParse(planEstimateRequest(found.rigSpec, found.plan))
    return {
      planId,
      planName: found.plan.name,
      input: parsed.success
        ? {
            planId,
            planName: found.plan.name,
            rigName: found.rigName,
            startTime: found.plan.startTime,
            request: parsed.data,
          }
        : null,
    }
  })
}

/** Checks every plan id of a body; throws a 400 naming the field. */
export function checkEventPlans(tx: Queryable, teamId: number, planIds: readonly number[]): void {
  teamPlans(tx, teamId, planIds)
}

/** The answer for a body of this team (a saved event or a preview). */
export function answerFor(
  tx: Queryable,
  teamId: number,
  body: Pick<EventBody, 'planIds' | 'pool' | 'chargers'>,
): EventAnswer {
  const planned = teamPlans(tx, teamId, body.planIds)
  const runnable = planned.flatMap((plan) => (plan.input ? [plan.input] : []))
  const answer = runEvent(runnable, body)
  const broken = planned.filter((plan) => plan.input === null)
  if (broken.length === 0) return answer
  return {
    ...answer,
    lasts: false,
    cautions: [
      ...broken.map((plan) => ({
        code: 'event-plan-needs-attention',
        severity: 'danger' as const,
        message: `The plan "${plan.planName}" no longer passes the checks and is left out of this answer. Open it, fix it and save it again.`,
      })),
      ...answer.cautions,
    ],
  }
}

/** The plan ids of an event, in the crew's order. */
export function eventPlanIds(tx: Queryable, eventId: number): number[] {
  return tx
    .select({ planId: eventPlans.planId })
    .from(eventPlans)
    .where(eq(eventPlans.eventId, eventId))
    .orderBy(asc(eventPlans.position))
    .all()
    .map((row) => row.planId)
}

export function replaceEventPlans(
  tx: Queryable,
  eventId: number,
  planIds: readonly number[],
): void {
  tx.delete(eventPlans).where(eq(eventPlans.eventId, eventId)).run()
  if (planIds.length === 0) return
  tx.insert(eventPlans)
    .values(planIds.map((planId, position) => ({ eventId, planId, position })))
    .run()
}

/** The events a plan is part of (a plan in an event cannot be deleted). */
export function eventsUsingPlan(tx: Queryable, planId: number): { id: number; name: string }[] {
  return tx
    .select({ id: events.id, name: events.name })
    .from(eventPlans)
    .innerJoin(events, eq(events.id, eventPlans.eventId))
    .where(eq(eventPlans.planId, planId))
    .orderBy(asc(events.name), asc(events.id))
    .all()
}
