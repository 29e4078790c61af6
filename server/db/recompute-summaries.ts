import { eq, isNull, ne, or } from 'drizzle-orm'
import { ENGINE_VERSION } from '../../shared/engine'
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import { storeEventSummary } from '../events/event-summaries'
import { planEstimateRequest, summarisePlan, summariseRig } from '../resources/summaries'
import type { DatabaseHandle } from './client'
import type { Queryable } from './queryable'
import { appMeta } from './schema'
import { events } from './schema-events'
import { plans, rigs } from './schema-resources'

/** The app_meta key holding the engine version that computed the stored summaries. */
export const summariesEngineVersionKey = 'summaries_engine_version'

export interface RecomputeReport {
  fromVersion: string | null
  toVersion: string
  rigs: number
  plans: number
  /** Events whose stored summary was missing (saved before it was stored) or older. */
  events: number
  /** Stored specs that no longer pass the schema: their summary is cleared, the spec is kept. */
  invalid: number
}

/**
 * Events keep the engine version of their summary row by row: an event with none (saved before
 * the column existed) or an older one is worked out again from its plans and rigs.
 */
function recomputeStaleEvents(tx: Queryable, engineVersion: string): number {
  const stale = tx
    .select()
    .from(events)
    .where(or(isNull(events.summaryEngineVersion), ne(events.summaryEngineVersion, engineVersion)))
    .all()
  for (const event of stale) storeEventSummary(tx, event)
  return stale.length
}

/**
 * When the engine's version differs from the one that computed the stored summaries, recomputes
 * every rig and plan summary and records the new version; then every event summary that is
 * missing or older. All in one transaction (all or none). Versions of the items do not change:
 * nobody edited them. Returns undefined when everything was up to date.
 */
export function recomputeSummaries(
  { db }: DatabaseHandle,
  engineVersion: string = ENGINE_VERSION,
): RecomputeReport | undefined {
  return db.transaction((tx) => {
    const stored =
      tx
        .select({ value: appMeta.value })
        .from(appMeta)
        .where(eq(appMeta.key, summariesEngineVersionKey))
        .get()?.value ?? null
    const report: RecomputeReport = {
      fromVersion: stored,
      toVersion: engineVersion,
      rigs: 0,
      plans: 0,
      events: 0,
      invalid: 0,
    }
    if (stored !== engineVersion) recomputeRigsAndPlans(tx, report, engineVersion)
    report.events = recomputeStaleEvents(tx, engineVersion)
    return stored === engineVersion && report.events === 0 ? undefined : report
  })
}

/** Every rig and plan summary anew (a spec no longer valid loses its summary), then the version. */
function recomputeRigsAndPlans(tx: Queryable, report: RecomputeReport, engineVersion: string) {
  const rigSpecs = new Map<number, unknown>()
  for (const rig of tx.select({ id: rigs.id, spec: rigs.spec }).from(rigs).all()) {
    rigSpecs.set(rig.id, rig.spec)
    const spec = estimateRequestSchema.safeParse(rig.spec)
    const summary = spec.success ? summariseRig(spec.data) : null
    if (!summary) report.invalid += 1
    tx.update(rigs)
      .set({ summary, summaryEngineVersion: summary?.engineVersion ?? null })
      .where(eq(rigs.id, rig.id))
      .run()
    report.rigs += 1
  }

  for (const plan of tx.select().from(plans).all()) {
    const rigSpec = estimateRequestSchema.safeParse(rigSpecs.get(plan.rigId))
    const request = rigSpec.success
      ? estimateRequestSchema.safeParse(planEstimateRequest(rigSpec.data, plan))
      : undefined
    const summary = request?.success ? summarisePlan(request.data, plan.startTime) : null
    if (!summary) report.invalid += 1
    tx.update(plans)
      .set({ summary, summaryEngineVersion: summary?.engineVersion ?? null })
      .where(eq(plans.id, plan.id))
      .run()
    report.plans += 1
  }

  tx.insert(appMeta)
    .values({ key: summariesEngineVersionKey, value: engineVersion })
    .onConflictDoUpdate({ target: appMeta.key, set: { value: engineVersion } })
    .run()
}
