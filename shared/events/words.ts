// The event's answer in words, the same on the page, the card and a shared card.
import { clockLabel } from '../plans/clock'
import type { EventAnswer, EventRigAnswer } from '../schemas/events'

/** "14:30" for a minute of the event clock (minutes after the event day's midnight). */
export function eventClock(minute: number): string {
  return clockLabel('00:00', minute)
}

/** The one-line verdict: does every rig last, or which does not and when. */
export function eventVerdict(answer: {
  lasts: boolean
  rigs: readonly Pick<EventRigAnswer, 'planName' | 'lasts' | 'stopsAtMinute'>[]
}): string {
  if (answer.rigs.length === 0) return 'Pick at least one plan to see the day.'
  if (answer.lasts) {
    return answer.rigs.length === 1
      ? 'The rig lasts the whole day.'
      : `All ${answer.rigs.length} rigs last the whole day.`
  }
  const failing = answer.rigs.filter((rig) => !rig.lasts)
  const parts = failing.map((rig) =>
    rig.stopsAtMinute !== null
      ? `${rig.planName} stops at ${eventClock(rig.stopsAtMinute)}`
      : `${rig.planName} has a danger to fix`,
  )
  return `Not every rig lasts: ${parts.join('; ')}.`
}

/** "2 × Crew tool pack 36 V, 5 Ah" per kind, with the spares on hand. */
export function packsToBringLines(answer: Pick<EventAnswer, 'kinds'>): string[] {
  return answer.kinds.map((kind) => {
    const spare = kind.onHand - kind.toBring
    const note =
      spare > 0
        ? ` (${kind.onHand} on hand: ${spare} spare)`
        : spare < 0
          ? ` (only ${kind.onHand} on hand: ${-spare} short)`
          : ''
    return `${kind.toBring} × ${kind.label}${note}`
  })
}
