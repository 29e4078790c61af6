// The pool's state of charge over the day: every pack on hand, wherever it is (in a rig, in the
// box, queued or on a charger), as the share of their full charge in watt-hours.
import { socAfterChargingPct, type ChargeablePack } from '../engine/charging'
import type { PoolCharger, PoolOutcome } from './pool'
import type { EventPoolPoint } from '../schemas/events'

interface Phase {
  fromMinute: number
  toMinute: number
  socAt: (minute: number) => number
}

export interface PoolChargeInput {
  startMinute: number
  endMinute: number
  kinds: readonly { key: string; count: number; nominalWh: number }[]
  packs: ReadonlyMap<string, ChargeablePack>
  chargers: readonly PoolCharger[]
  outcome: PoolOutcome
}

// Ours: a point every 10 minutes reads well on a day's chart; at most 200 points for a long one.
const STEP_MINUTES = 10
const MAX_POINTS = 200

export function poolChargeSeries(input: PoolChargeInput): EventPoolPoint[] {
  const phases = new Map<string, Phase[]>()
  const phasesOf = (kindKey: string, packNumber: number) => {
    const key = `${kindKey}#${packNumber}`
    const list = phases.get(key) ?? []
    phases.set(key, list)
    return list
  }
  for (const demand of input.outcome.demands) {
    for (const turn of demand.served) {
      // In a rig the charge falls from full to where the pack left; drawn as a straight line
      // (the plan's own chart shows the curve).
      phasesOf(demand.kindKey, turn.packNumber).push({
        fromMinute: turn.startMinute,
        // A pack that comes out as the day ends keeps what it has left.
        toMinute: turn.endMinute >= input.endMinute ? Number.POSITIVE_INFINITY : turn.endMinute,
        socAt: (minute) =>
          100 -
          ((100 - turn.endSocPct) * (minute - turn.startMinute)) /
            (turn.endMinute - turn.startMinute || 1),
      })
    }
  }
  for (const session of input.outcome.sessions) {
    const list = phasesOf(session.kindKey, session.packNumber)
    list.push({
      fromMinute: session.queuedMinute,
      toMinute: session.onMinute,
      socAt: () => session.fromSocPct,
    })
    const pack = input.packs.get(session.kindKey)
    const powerW = input.chargers[session.chargerIndex]?.powerW ?? 0
    list.push({
      fromMinute: session.onMinute,
      toMinute: session.offMinute ?? Number.POSITIVE_INFINITY,
      socAt: (minute) =>
        pack
          ? socAfterChargingPct(pack, session.fromSocPct, powerW, (minute - session.onMinute) / 60)
          : session.fromSocPct,
    })
  }
  for (const pack of input.outcome.neverCharged) {
    phasesOf(pack.kindKey, pack.packNumber).push({
      fromMinute: pack.queuedMinute,
      toMinute: Number.POSITIVE_INFINITY,
      socAt: () => pack.socPct,
    })
  }

  const totalWh = input.kinds.reduce((sum, kind) => sum + kind.count * kind.nominalWh, 0)
  const span = Math.max(input.endMinute - input.startMinute, 0)
  const step = Math.max(STEP_MINUTES, Math.ceil(span / MAX_POINTS))
  const minutes: number[] = []
  for (let minute = input.startMinute; minute < input.endMinute; minute += step)
    minutes.push(minute)
  minutes.push(input.endMinute)

  return minutes.map((minute) => {
    let storedWh = 0
    let chargedInBox = 0
    for (const kind of input.kinds) {
      for (let packNumber = 1; packNumber <= kind.count; packNumber++) {
        const phase = phases
          .get(`${kind.key}#${packNumber}`)
          ?.find((candidate) => minute >= candidate.fromMinute && minute < candidate.toMinute)
        const socPct = phase ? phase.socAt(minute) : 100
        if (!phase) chargedInBox++
        storedWh += (socPct / 100) * kind.nominalWh
      }
    }
    return {
      minute,
      socPct: totalWh > 0 ? (100 * storedWh) / totalWh : 0,
      chargedInBox,
    }
  })
}
