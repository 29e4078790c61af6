// A plan is run as its rig's estimate request with the plan's day, weather and packs in it: the
// server does this for the stored summary and the browser for the live chart.
import type { EstimateRequest, ScheduleSegment, SwapPolicy } from '../schemas/estimate'

/** A plan's own fields that override its rig's spec for the day's run. */
export interface PlanRunFields {
  temperatureC: number | null
  packCount: number | null
  swapPolicy: SwapPolicy | null
  schedule: ScheduleSegment[]
}

export function planEstimateRequest(
  rigSpec: EstimateRequest,
  plan: PlanRunFields,
): EstimateRequest {
  return {
    ...rigSpec,
    pack: { ...rigSpec.pack, ...(plan.packCount !== null ? { count: plan.packCount } : {}) },
    schedule: plan.schedule,
    ...(plan.temperatureC !== null ? { temperatureC: plan.temperatureC } : {}),
    ...(plan.swapPolicy ? { swapPolicy: plan.swapPolicy } : {}),
  }
}
