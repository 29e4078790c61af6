// What a sound level meter should read in each segment with music, so the crew sets the level by
// meter at the audience's distance rather than by ear.
import { DEFAULT_LISTENER_DISTANCE_M } from '../engine/sound'
import type { EstimateRequest, EstimateResult, SegmentResult } from '../schemas/estimate'
import { distanceWords } from './format'

/** The audience's distance the levels are estimated at: the plan's, or the engine's default. */
export function meterDistanceM(request: EstimateRequest): number {
  return request.listenerDistanceM ?? DEFAULT_LISTENER_DISTANCE_M
}

/**
 * "Meter about 94 dBA" for a segment with music; null for a silent one. The distance it holds at
 * is said once, in the meter note.
 */
export function meterLine(segment: SegmentResult | undefined): string | null {
  if (segment?.playingSplDb === undefined) return null
  return `Meter about ${Math.round(segment.playingSplDb)} dBA`
}

/**
 * How to use the meter readings, said once on the card. A-weighting and the slow time weighting
 * are the usual settings for setting a music level (IEC 61672-1 defines both); the figures come
 * from the speakers' sensitivity in free field, so the meter on the day has the last word.
 */
export function meterNote(request: EstimateRequest, result: EstimateResult): string | null {
  const loud = (result.schedule?.segments ?? []).some((row) => row.playingSplDb !== undefined)
  if (!loud) return null
  return `Set each level with a sound level meter (A-weighted, slow) held at the audience's distance, ${distanceWords(meterDistanceM(request))}, while the music plays, and turn down if it reads higher. The readings given are free-field estimates from the speakers' data: walls, wind, the crowd and the speakers' real response move them by several dB. Follow local rules.`
}
