import {
  analyseDischarge,
  type DischargePoint,
  type DischargeSample,
} from '../../shared/discharge/analyse'
import type { DischargeFigures } from '../../shared/discharge/log'

/** The two stored columns of a log: its figures (with the limits read against) and its points. */
export function storedAnalysis(
  samples: readonly DischargeSample[],
  limits: { cutoffV: number; ratedAh: number },
): { analysis: DischargeFigures; points: DischargePoint[] } {
  const { points, ...figures } = analyseDischarge(samples, limits)
  return { analysis: { ...figures, ...limits, sampleCount: samples.length }, points }
}
