import { eq } from 'drizzle-orm'
import { ENGINE_VERSION } from '../../shared/engine'
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import { planEstimateRequest, summarisePlan, summariseRig } from '../resources/summaries'
import type { DatabaseHandle } from './client'
import { appMeta } from './schema'
import { plans, rigs } from './schema-resources'

/** The app_meta key holding the engine version that computed the stored summaries. */
export const summariesEngineVersionKey = 'summaries_engine_version'

export interface RecomputeReport {
  fromVersion: string | null
  toVersion: string
  rigs: number
  plans: number
  /** Stored specs that no longer pass the schema: their summary is cleared, the spec is kept. */
  invalid: number
}

/**
 * When the engine's version differs from the one that computed the stored summaries, recomputes
 * every rig and plan summary and records the new version, all in one transaction (all or none).
 * Versions of the items do not change: nobody edited them. Returns undefined when up to date.
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
    if (stored === engineVersion) return undefined
    const report: RecomputeReport = {
      fromVersion: stored,
      toVersion: engineVersion,
      rigs: 0,
      plans: 0,
      invalid: 0,
    }

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
    return report
  })
}
