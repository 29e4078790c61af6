import { and, eq } from 'drizzle-orm'
import type { Queryable } from '../db/queryable'
import { plans, rigs } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import { buildRuntimeCard } from '../../shared/card/build'
import type { RuntimeCard } from '../../shared/card/model'
import { estimate } from '../../shared/engine'
import { planEstimateRequest } from '../../shared/plans/request'
import { estimateRequestSchema } from '../../shared/schemas/estimate'

export type PlanRow = typeof plans.$inferSelect

export const planNotFound = () => new ApiError(404, 'not-found', 'No such plan in this team.')

/** The team's plan, or 404 (another team's plan is as unknown as a missing one). */
export function requireTeamPlan(db: Queryable, teamId: number, planId: number): PlanRow {
  const plan = db
    .select()
    .from(plans)
    .where(and(eq(plans.id, planId), eq(plans.teamId, teamId)))
    .get()
  if (!plan) throw planNotFound()
  return plan
}

/**
 * The card of a plan as it is now: the rig's spec with the plan's day in it, run by the engine.
 * A plan whose rig no longer passes the schema has no card until someone saves it again.
 */
export function planCard(db: Queryable, plan: PlanRow): RuntimeCard {
  const rig = db
    .select({ name: rigs.name, spec: rigs.spec })
    .from(rigs)
    .where(eq(rigs.id, plan.rigId))
    .get()
  const parsed = rig && estimateRequestSchema.safeParse(planEstimateRequest(rig.spec, plan))
  if (!rig || !parsed?.success) {
    throw new ApiError(
      409,
      'card-unavailable',
      'This plan needs attention before its card can be shown: open the plan and save it again.',
    )
  }
  return buildRuntimeCard({
    title: plan.name,
    rigName: rig.name,
    notes: plan.notes,
    event: { date: plan.date, startTime: plan.startTime },
    request: parsed.data,
    result: estimate(parsed.data, { timeline: false }),
  })
}
