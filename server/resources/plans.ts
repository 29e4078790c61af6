import { and, eq } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { plans, rigs } from '../db/schema-resources'
import { ApiError, issuesFromZod } from '../http/errors'
import { eventsUsingPlan } from '../events/event-plans'
import { recomputeEventsOfPlans } from '../events/event-summaries'
import { ownedRowsOf } from './owned-table'
import { summarisePlan } from './summaries'
import type { ResourceDefinition, WriteScope } from './resource-definition'
import { planEstimateRequest, type PlanRunFields } from '../../shared/plans/request'
import { estimateRequestSchema, type EstimateRequest } from '../../shared/schemas/estimate'
import {
  planBodySchema,
  planUpdateSchema,
  type PlanBody,
  type PlanItem,
} from '../../shared/schemas/plans'

type PlanRow = typeof plans.$inferSelect

function runFieldsOf(body: PlanBody): PlanRunFields {
  return {
    temperatureC: body.temperatureC ?? null,
    packCount: body.packCount ?? null,
    swapPolicy: body.swapPolicy ?? null,
    schedule: body.schedule,
  }
}

function refuse(path: string, message: string): never {
  throw new ApiError(400, 'invalid-input', `The request body is not valid. ${path}: ${message}`, [
    { path, message },
  ])
}

/**
 * The day's estimate request: the team's rig with the plan's fields in it, validated as a whole
 * (a rig saved under an older schema could fail). A 400 names the field; nothing is written.
 */
function planRequest(tx: Queryable, teamId: number, body: PlanBody): EstimateRequest {
  const rig = tx
    .select({ name: rigs.name, spec: rigs.spec })
    .from(rigs)
    .where(and(eq(rigs.id, body.rigId), eq(rigs.teamId, teamId)))
    .get()
  if (!rig) refuse('rigId', `No rig with id ${body.rigId} in this team`)
  const parsed = estimateRequestSchema.safeParse(planEstimateRequest(rig.spec, runFieldsOf(body)))
  if (!parsed.success) {
    const first = issuesFromZod(parsed.error)[0]
    refuse(
      'rigId',
      `The rig "${rig.name}" no longer passes the estimate checks (${first?.path}: ${first?.message}); open it on the bench and save it again`,
    )
  }
  return parsed.data
}

function writeSummary(tx: Queryable, planId: number, request: EstimateRequest, startTime: string) {
  const summary = summarisePlan(request, startTime)
  tx.update(plans)
    .set({ summary, summaryEngineVersion: summary.engineVersion })
    .where(eq(plans.id, planId))
    .run()
}

/**
 * A rig's plans run on its spec: when the rig is saved, their summaries are recomputed in the
 * same transaction (their versions stay: nobody edited the plans), and so are the summaries of
 * the events they are part of. A plan that no longer validates with the new spec keeps its
 * fields and loses its summary (its events say it needs attention).
 */
export function recomputePlansOfRig(tx: Queryable, rigId: number, rigSpec: EstimateRequest): void {
  const rigPlans = tx.select().from(plans).where(eq(plans.rigId, rigId)).all()
  for (const plan of rigPlans) {
    const parsed = estimateRequestSchema.safeParse(planEstimateRequest(rigSpec, plan))
    if (parsed.success) {
      writeSummary(tx, plan.id, parsed.data, plan.startTime)
    } else {
      tx.update(plans)
        .set({ summary: null, summaryEngineVersion: null })
        .where(eq(plans.id, plan.id))
        .run()
    }
  }
  recomputeEventsOfPlans(
    tx,
    rigPlans.map((plan) => plan.id),
  )
}

function rigNameOf(tx: Queryable, rigId: number): string {
  return tx.select({ name: rigs.name }).from(rigs).where(eq(rigs.id, rigId)).get()?.name ?? ''
}

/** Event plans: `/api/v1/teams/:teamId/plans`. The server runs the day at every save. */
export const planDefinition: ResourceDefinition<typeof plans, PlanBody, PlanItem> = {
  rows: ownedRowsOf(plans),
  noun: 'plan',
  idParam: 'planId',
  createSchema: planBodySchema,
  updateSchema: planUpdateSchema,
  values: (body, owned) => ({
    ...owned,
    rigId: body.rigId,
    date: body.date,
    startTime: body.startTime,
    // A PUT replaces the plan: a field left out falls back to the rig's own value.
    ...runFieldsOf(body),
  }),
  checkBody: ({ tx, teamId }: WriteScope, body) => {
    planRequest(tx, teamId, body)
  },
  afterWrite: ({ tx, teamId }, planId, body) => {
    writeSummary(tx, planId, planRequest(tx, teamId, body), body.startTime)
    recomputeEventsOfPlans(tx, [planId])
  },
  // A plan in an event is refused rather than dropped: the event's answer would change unseen.
  beforeDelete: ({ tx }, row) => {
    const using = eventsUsingPlan(tx, row.id)
    if (using.length === 0) return undefined
    const names = using.map((event) => `"${event.name}"`).join(', ')
    throw new ApiError(
      409,
      'plan-in-event',
      `This plan is part of ${using.length === 1 ? 'the event' : 'the events'} ${names}. Take it out of ${using.length === 1 ? 'that event' : 'those events'} first, then delete it.`,
    )
  },
  bodyOf: (_tx, row: PlanRow) => ({
    name: row.name,
    notes: row.notes,
    rigId: row.rigId,
    date: row.date,
    startTime: row.startTime,
    temperatureC: row.temperatureC,
    packCount: row.packCount,
    swapPolicy: row.swapPolicy,
    schedule: row.schedule,
  }),
  toItem: (tx, row, meta) => ({
    ...meta,
    rigId: row.rigId,
    rigName: rigNameOf(tx, row.rigId),
    date: row.date,
    startTime: row.startTime,
    temperatureC: row.temperatureC,
    packCount: row.packCount,
    swapPolicy: row.swapPolicy ?? null,
    schedule: row.schedule,
    summary: row.summary ?? null,
  }),
}
