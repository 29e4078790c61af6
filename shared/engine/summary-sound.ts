// Sound at the listener and the day's exposure, from the segment that plays loudest
// (docs/model.md §8 and §10, loudness of several drivers).
import type { EstimateResult } from '../schemas/estimate'
import type { PreparedRig } from './estimate'
import type { RunSegment } from './run'
import { listenerLevelDb } from './segment-levels'
import { equivalentLevelDb, nioshPermittedMinutes, WHO_VENUE_LAEQ_DB } from './sound'

/** The segment that plays loudest on average (its level sets the sound figures), if any plays. */
export function loudestSegment(segments: readonly RunSegment[]): RunSegment | null {
  let loudest: RunSegment | null = null
  for (const segment of segments) {
    if (segment.state !== 'on' || segment.playingShare <= 0) continue
    const averageW = segment.outputPerChannelW * segment.playingShare
    if (!loudest || averageW > loudest.outputPerChannelW * loudest.playingShare) loudest = segment
  }
  return loudest
}

/** Sound at the listener from the loudest segment, and the day's exposure. */
export function soundFigures(
  prepared: PreparedRig,
  loudest: RunSegment | null,
): { splDb: EstimateResult['splDb']; exposure: EstimateResult['exposure'] } {
  const { resolved } = prepared
  const speakers = resolved.speakers
  if (speakers.sensitivityDb === null || !loudest) return { splDb: undefined, exposure: undefined }
  // Through the speaker leads' share, summed in power over the drivers facing the listener.
  const levelAt = (channelPowerW: number) => listenerLevelDb(prepared, channelPowerW) ?? 0
  const average = equivalentLevelDb(levelAt(loudest.outputPerChannelW), loudest.playingShare)
  // Peaks are at least the level while playing (a programme under 3 dB crest factor).
  const peak = levelAt(Math.max(loudest.peakPerChannelW, loudest.outputPerChannelW))
  let dosePct: number | undefined
  if (resolved.schedule) {
    dosePct = 0
    for (const segment of prepared.segments) {
      if (segment.state !== 'on' || segment.playingShare <= 0) continue
      const level = equivalentLevelDb(levelAt(segment.outputPerChannelW), segment.playingShare)
      dosePct += (100 * segment.durationS) / 60 / nioshPermittedMinutes(level)
    }
  }
  return {
    splDb: { average, peak },
    exposure: {
      permittedMinutes: nioshPermittedMinutes(average),
      levelDb: average,
      ...(dosePct === undefined ? {} : { dosePct }),
      overWhoVenueLimit: average > WHO_VENUE_LAEQ_DB,
    },
  }
}
