import { estimate } from '../../shared/engine'
import type { EstimateRequest, EstimateResult, Severity } from '../../shared/schemas/estimate'
import type { PlanSummary, RigSummary } from '../../shared/schemas/resources'
import { clockTimeAfter } from '../../shared/plans/clock'

// The headline of an engine run that is stored beside a rig or plan, so lists show runtime and
// warnings without running the engine for every row.

const severityRank: Record<Severity, number> = { info: 0, caution: 1, danger: 2 }

function worstSeverity(result: EstimateResult): Severity | null {
  let worst: Severity | null = null
  for (const warning of result.warnings) {
    if (worst === null || severityRank[warning.severity] > severityRank[worst]) {
      worst = warning.severity
    }
  }
  return worst
}

function headline(result: EstimateResult): RigSummary {
  return {
    engineVersion: result.engineVersion,
    runtimeHours: result.runtimeHours,
    stopReason: result.stopReason,
    averageDrawW: result.averageDrawW,
    warningCount: result.warnings.length,
    worstSeverity: worstSeverity(result),
    ...(result.schedule
      ? { lasts: result.schedule.lasts, packsUsed: result.schedule.packsUsed }
      : {}),
  }
}

/** Runs the engine on a validated spec. */
export function summariseRig(spec: EstimateRequest): RigSummary {
  return headline(estimate(spec))
}

// Shared with the browser, so both sides put swaps on the same event clock.
export { clockTimeAfter } from '../../shared/plans/clock'
export { planEstimateRequest, type PlanRunFields } from '../../shared/plans/request'

export function summarisePlan(request: EstimateRequest, startTime: string): PlanSummary {
  const result = estimate(request)
  const schedule = result.schedule
  return {
    ...headline(result),
    lasts: schedule?.lasts ?? false,
    packsUsed: schedule?.packsUsed ?? 1,
    swaps: (schedule?.swaps ?? []).map((swap) => ({
      atMinute: swap.atMinute,
      atTime: clockTimeAfter(startTime, swap.atMinute),
    })),
  }
}
