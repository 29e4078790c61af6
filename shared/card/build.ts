// The one function that turns a plan (or a rig alone) and its engine result into the runtime
// card. The web card, the shared page and the e-mail all show what this returns.
import { chargingPermitted } from '../engine/charging'
import { packsNeededForSchedule } from '../engine/compare'
import { DEFAULT_TEMPERATURE_C } from '../engine/resolve'
import { onEventClock } from '../engine/moment'
import { clockLabel } from '../plans/clock'
import type { EstimateRequest, EstimateResult, ScheduleSegment } from '../schemas/estimate'
import { CARD_DISCLAIMER, cardCautions } from './cautions'
import { dateWords, distanceWords, durationWords, figure, plural, temperatureWords } from './format'
import type { CardSegment, CardSwap, CardWarning, RuntimeCard } from './model'
import { meterLine, meterNote } from './meter'
import { packLine, rigLine } from './rig-line'

export interface CardEvent {
  /** YYYY-MM-DD, the event's local date. */
  date: string
  /** HH:MM, the event's local start. */
  startTime: string
}

export interface CardSource {
  /** The plan's name, or the rig's for a rig alone. */
  title: string
  rigName: string
  notes?: string
  /** The plan's day; absent for a rig alone (times are then counted from switching on). */
  event?: CardEvent
  /** The request the engine ran: for a plan, its rig's spec with the plan's fields in it. */
  request: EstimateRequest
  result: EstimateResult
}

/** Where a minute of the run falls: on the event clock, or as time since switching on. */
type MinuteLabel = (minute: number) => string

function minuteLabeller(event: CardEvent | undefined): MinuteLabel {
  if (event) return (minute) => clockLabel(event.startTime, minute)
  return (minute) => (minute < 0.5 ? 'start' : `after ${durationWords(minute)}`)
}

function swapsOf(result: EstimateResult, label: MinuteLabel): CardSwap[] {
  const packsUsed = result.schedule?.packsUsed ?? result.packRuns.length
  // A scheduled run lists its swaps; an open run's later packs each began with a swap.
  const swaps =
    result.schedule?.swaps ??
    result.packRuns.slice(1).map((run) => ({ atMinute: run.startMinute, pack: run.pack }))
  return swaps.map((swap) => ({
    atMinute: swap.atMinute,
    atLabel: label(swap.atMinute),
    packIn: swap.pack,
    instruction: `Swap in charged pack ${swap.pack} of ${packsUsed}`,
  }))
}

function noSwapNoteOf(result: EstimateResult): string {
  if (!result.schedule) return 'No swap: the run uses one pack.'
  return result.schedule.lasts
    ? 'No swap needed: the first pack lasts the day.'
    : 'No charged pack to swap in: see the packs to bring.'
}

function activityOf(segment: ScheduleSegment, request: EstimateRequest): string {
  const state = segment.state ?? 'on'
  if (state === 'off') return 'Rig switched off'
  if (state === 'idle') return 'Rig on, no music'
  if (state === 'charging') {
    // The engine gives the pack nothing here outside its charge range: the crew must not either.
    const temperatureC = request.temperatureC ?? DEFAULT_TEMPERATURE_C
    if (!chargingPermitted(request.pack.chemistry, temperatureC)) {
      return `Rig silent; do NOT charge its pack at ${temperatureWords(temperatureC)} (see the warnings)`
    }
    const power = segment.chargeW === undefined ? '' : ` (${figure(segment.chargeW, 0)} W into it)`
    return `Rig silent; its pack on the charger${power}`
  }
  const playingPct = segment.playingPct ?? request.programme.playingPct
  const peakBelowClipDb = segment.peakBelowClipDb ?? request.programme.peakBelowClipDb
  const playing = playingPct === undefined ? '' : ` ${figure(playingPct, 0)} % of the time;`
  return `Sound${playing} peaks ${figure(peakBelowClipDb)} dB below clipping`
}

function segmentsOf(
  request: EstimateRequest,
  result: EstimateResult,
  label: MinuteLabel,
): CardSegment[] {
  let startMinute = 0
  const levels = result.schedule?.segments ?? []
  return (request.schedule ?? []).map((segment, index) => {
    const row = {
      startLabel: label(startMinute),
      endLabel: label(startMinute + segment.minutes),
      label: segment.label,
      activity: activityOf(segment, request),
      meter: meterLine(levels[index]),
    }
    startMinute += segment.minutes
    return row
  })
}

const severityOrder = { danger: 0, caution: 1 } as const

/** Warnings the hearing caution restates with the same figures, so the card says them once. */
export const RESTATED_BY_CAUTIONS: readonly string[] = ['hearing-caution', 'children-present']

function keyWarnings(result: EstimateResult, event: CardEvent | undefined): CardWarning[] {
  return result.warnings
    .filter(
      (warning) => warning.severity !== 'info' && !RESTATED_BY_CAUTIONS.includes(warning.code),
    )
    .map((warning) => ({
      code: warning.code,
      severity: warning.severity as CardWarning['severity'],
      // A plan's card names moments on its clock; a rig's card, as time since switching on.
      message: event
        ? onEventClock(warning, (minute) => clockLabel(event.startTime, minute))
        : warning.message,
    }))
    .sort((a, b) => severityOrder[a.severity] - severityOrder[b.severity])
}

function runtimeOf(result: EstimateResult, label: MinuteLabel): RuntimeCard['runtime'] {
  const runtimeMinutes = result.runtimeHours * 60
  const musicMinutes = result.musicHours * 60
  const music = `${durationWords(musicMinutes)} of it with sound`
  const schedule = result.schedule
  if (!schedule) {
    return {
      lasts: null,
      headline: `Runs about ${durationWords(runtimeMinutes)} on the packs on hand at the rig's level (${music}).`,
      runtimeMinutes,
      musicMinutes,
      stopsAtLabel: null,
    }
  }
  if (schedule.lasts) {
    return {
      lasts: true,
      headline: `Lasts the whole ${durationWords(schedule.totalMinutes)} at the planned levels (${music}).`,
      runtimeMinutes,
      musicMinutes,
      stopsAtLabel: null,
    }
  }
  const stoppedAt = schedule.stoppedAtMinute ?? runtimeMinutes
  return {
    lasts: false,
    headline: `Does NOT last: sound stops at ${label(stoppedAt)}, ${durationWords(schedule.totalMinutes - stoppedAt)} before the end, unless more charged packs come.`,
    runtimeMinutes,
    musicMinutes,
    stopsAtLabel: label(stoppedAt),
  }
}

function packsOf(request: EstimateRequest, result: EstimateResult): RuntimeCard['packs'] {
  const onHand = result.pack.count
  const packLabel = packLine(request, result)
  const schedule = result.schedule
  if (!schedule) {
    return {
      bringCharged: onHand,
      onHand,
      packLabel,
      headline: `Bring ${plural(onHand, 'charged pack')}.`,
    }
  }
  if (schedule.lasts) {
    const spare = onHand - schedule.packsUsed
    return {
      bringCharged: schedule.packsUsed,
      onHand,
      packLabel,
      headline: `Bring ${plural(schedule.packsUsed, 'charged pack')}${spare > 0 ? ` (the plan has ${plural(spare, 'spare')} on hand)` : ''}.`,
    }
  }
  const needed = packsNeededForSchedule(request)
  return {
    bringCharged: needed ?? onHand,
    onHand,
    packLabel,
    headline:
      needed === null
        ? `The ${plural(onHand, 'pack')} on hand do not last, and more packs alone will not do: lower the level or use larger packs.`
        : `Bring ${plural(needed, 'charged pack')}: the ${plural(onHand, 'pack')} in the plan do not last the day.`,
  }
}

function conditionsOf(request: EstimateRequest, result: EstimateResult): string {
  const temperature = result.assumed.find((value) => value.field === 'temperatureC')
  const temperatureC =
    request.temperatureC ?? (typeof temperature?.value === 'number' ? temperature.value : undefined)
  const parts: string[] = []
  if (temperatureC !== undefined) parts.push(`Packs at ${temperatureWords(temperatureC)}`)
  if (request.listenerDistanceM !== undefined) {
    parts.push(`listeners from ${distanceWords(request.listenerDistanceM)}`)
  }
  if (request.childrenPresent) parts.push('children present')
  return parts.join(' · ')
}

function soundOf(request: EstimateRequest, result: EstimateResult): string | null {
  if (!result.splDb || request.listenerDistanceM === undefined) return null
  return `About ${Math.round(result.splDb.average)} dB on average (peaks about ${Math.round(result.splDb.peak)} dB) at ${distanceWords(request.listenerDistanceM)} while sound plays.`
}

export function buildRuntimeCard(source: CardSource): RuntimeCard {
  const { request, result, event } = source
  const label = minuteLabeller(event)
  const totalMinutes = result.schedule?.totalMinutes
  return {
    kind: event ? 'plan' : 'rig',
    title: source.title,
    rigName: source.rigName,
    dateLabel: event ? dateWords(event.date) : null,
    timeLabel:
      event && totalMinutes !== undefined
        ? `${event.startTime} to ${clockLabel(event.startTime, totalMinutes)}`
        : (event?.startTime ?? null),
    rigLine: rigLine(request, result),
    conditions: conditionsOf(request, result),
    runtime: runtimeOf(result, label),
    packs: packsOf(request, result),
    swaps: swapsOf(result, label),
    noSwapNote: noSwapNoteOf(result),
    segments: segmentsOf(request, result, label),
    meterNote: meterNote(request, result),
    sound: soundOf(request, result),
    warnings: keyWarnings(result, event),
    cautions: cardCautions(request, result),
    notes: source.notes ?? '',
    disclaimer: CARD_DISCLAIMER,
    engineVersion: result.engineVersion,
  }
}
