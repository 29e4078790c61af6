// The crew lead's run sheet: every action of the day in time order (a rig starts, a pack is
// swapped, a pack goes on or comes off a charger), as the event card lists it.
import type { EventCard } from '../schemas/events'

export interface EventStep {
  minute: number
  who: string
  what: string
}

export function eventSteps(answer: EventCard['answer']): EventStep[] {
  const steps: EventStep[] = []
  for (const rig of answer.rigs) {
    rig.turns.forEach((turn, index) => {
      steps.push({
        minute: turn.startMinute,
        who: rig.planName,
        what: index === 0 ? `Start on ${turn.packName}` : `Swap in ${turn.packName}`,
      })
    })
    if (rig.stopsAtMinute !== null) {
      steps.push({ minute: rig.stopsAtMinute, who: rig.planName, what: 'Stops: no charged pack' })
    } else {
      steps.push({ minute: rig.endMinute, who: rig.planName, what: 'Day ends' })
    }
  }
  for (const session of answer.sessions) {
    steps.push({
      minute: session.onMinute,
      who: session.chargerLabel,
      what: `Put ${session.packName} on (slot ${session.slot})`,
    })
    if (session.offMinute !== null) {
      steps.push({
        minute: session.offMinute,
        who: session.chargerLabel,
        what: `${session.packName} full: into the box`,
      })
    }
  }
  // Same minute: charger actions after the swap that frees the pack, in a stable order.
  return steps.sort((a, b) => a.minute - b.minute)
}
