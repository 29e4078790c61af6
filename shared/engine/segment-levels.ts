// Each segment of the day: when it starts, what it draws and how loud it is at the listener, so
// a plan shows every part of the day and a card can say what a sound level meter should read.
import type { SegmentResult } from '../schemas/estimate'
import type { PreparedRig } from './estimate'
import type { RunOutcome } from './run'
import { driversPerChannel } from './speakers'
import { equivalentLevelDb, nioshPermittedMinutes, soundLevelDb } from './sound'

/**
 * Level at the listener for an amplifier output per channel: the speaker leads' share reaches
 * the drivers, shared equally among them. Null without the drivers' sensitivity.
 */
export function listenerLevelDb(prepared: PreparedRig, channelPowerW: number): number | null {
  const { speakers, listenerDistanceM, boundaryGainDb } = prepared.resolved
  if (speakers.sensitivityDb === null) return null
  const driverPowerW =
    (channelPowerW * prepared.speakerLeads.speakerShare) / driversPerChannel(speakers)
  return soundLevelDb(
    speakers.sensitivityDb,
    driverPowerW,
    speakers.facingListener,
    listenerDistanceM,
    boundaryGainDb,
  )
}

/**
 * One row per planned segment. Draw is the run's average over the minutes it ran the segment
 * (0 after the run stopped; negative while charging: power into the pack). Levels are given for
 * segments with music: the level while playing, and the equivalent level over the segment with
 * its pauses, which sets the NIOSH permitted time.
 */
export function segmentResults(prepared: PreparedRig, outcome: RunOutcome): SegmentResult[] {
  const rows: SegmentResult[] = []
  let startS = 0
  let before = { deliveredJ: 0, chargedJ: 0, elapsedS: 0 }
  prepared.segments.forEach((segment, index) => {
    const after = outcome.segmentEnds[index] ?? before
    const ranS = after.elapsedS - before.elapsedS
    const netJ = after.deliveredJ - before.deliveredJ - (after.chargedJ - before.chargedJ)
    const row: SegmentResult = {
      label: segment.label,
      state: segment.state,
      startMinute: startS / 60,
      minutes: segment.durationS / 60,
      drawW: ranS > 0 ? netJ / ranS : 0,
    }
    const playingDb =
      segment.state === 'on' && segment.playingShare > 0
        ? listenerLevelDb(prepared, segment.outputPerChannelW)
        : null
    if (playingDb !== null) {
      const averageDb = equivalentLevelDb(playingDb, segment.playingShare)
      row.playingSplDb = playingDb
      row.splDb = averageDb
      row.permittedMinutes = nioshPermittedMinutes(averageDb)
    }
    rows.push(row)
    startS += segment.durationS
    before = after
  })
  return rows
}
