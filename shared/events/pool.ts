// The event's box of packs and the venue's chargers as discrete events in time order: a rig takes
// a charged pack of its kind at each turn; the pack it gives back waits for a free charger slot
// that fits its kind, charges to full (engine/charging.ts) and goes back into the box.
import { chargeHoursToFull, type ChargeablePack } from '../engine/charging'

/** Minutes are on the event clock: after midnight of the event's day. */
export interface PoolTurn {
  startMinute: number
  endMinute: number
  endSocPct: number
}

export interface PoolDemand {
  kindKey: string
  turns: PoolTurn[]
}

export interface PoolCharger {
  powerW: number
  slots: number
  /** Kinds this charger may charge today (the ones it fits, less any it must not charge). */
  kindKeys: readonly string[]
}

export interface PoolInput {
  demands: readonly PoolDemand[]
  /** Charging figures of each kind, by key. */
  packs: ReadonlyMap<string, ChargeablePack>
  /** Packs on hand per kind, all charged at the start. */
  counts: ReadonlyMap<string, number>
  chargers: readonly PoolCharger[]
  /** The day's end: a charge that would finish later is left unfinished. */
  endMinute: number
}

export interface ServedTurn extends PoolTurn {
  packNumber: number
}

export interface DemandOutcome {
  kindKey: string
  served: ServedTurn[]
  /** The minute a turn found no charged pack of its kind; null when every turn was served. */
  shortAtMinute: number | null
  /** Whether a pack of the kind was then on a charger or waiting for one. */
  waitedOnCharger: boolean
}

export interface PoolSession {
  chargerIndex: number
  slot: number
  kindKey: string
  packNumber: number
  queuedMinute: number
  onMinute: number
  offMinute: number | null
  fromSocPct: number
}

export interface PoolOutcome {
  demands: DemandOutcome[]
  sessions: PoolSession[]
  /** Packs that left a rig and waited in the queue with no slot before the day ended. */
  neverCharged: { kindKey: string; packNumber: number; queuedMinute: number; socPct: number }[]
  longestQueueMinutes: number
}

// At one minute: a charge that ends frees its pack first, then packs come out of rigs, then rigs
// take packs, so a pack that is full at 10:00 serves a swap at 10:00.
const enum Order {
  Full = 0,
  Release = 1,
  Need = 2,
}

interface Happening {
  minute: number
  order: Order
  sequence: number
  run: () => void
}

interface Waiting {
  kindKey: string
  packNumber: number
  queuedMinute: number
  socPct: number
}

// A pack back within this of full needs no charger.
const FULL_ENOUGH_PCT = 99.5

export function simulatePool(input: PoolInput): PoolOutcome {
  const queue: Happening[] = []
  let sequence = 0
  const at = (minute: number, order: Order, run: () => void) => {
    queue.push({ minute, order, sequence: sequence++, run })
  }

  const box = new Map<string, number[]>()
  for (const [kindKey, count] of input.counts) {
    box.set(
      kindKey,
      Array.from({ length: count }, (_, index) => index + 1),
    )
  }
  const busy = input.chargers.map((charger) => Array<boolean>(charger.slots).fill(false))
  const waiting: Waiting[] = []
  const sessions: PoolSession[] = []
  const outcomes: DemandOutcome[] = input.demands.map((demand) => ({
    kindKey: demand.kindKey,
    served: [],
    shortAtMinute: null,
    waitedOnCharger: false,
  }))
  const charging = new Map<string, number>()
  let longestQueueMinutes = 0

  const putInBox = (kindKey: string, packNumber: number) => {
    const packs = box.get(kindKey) ?? []
    packs.push(packNumber)
    packs.sort((a, b) => a - b)
    box.set(kindKey, packs)
  }

  const startCharges = (minute: number) => {
    for (let index = 0; index < waiting.length;) {
      const pack = waiting[index]!
      const placed = placeOnCharger(pack, minute)
      if (placed) waiting.splice(index, 1)
      else index++
    }
  }

  const placeOnCharger = (pack: Waiting, minute: number): boolean => {
    for (const [chargerIndex, charger] of input.chargers.entries()) {
      if (!charger.kindKeys.includes(pack.kindKey)) continue
      const slot = busy[chargerIndex]!.indexOf(false)
      if (slot < 0) continue
      const figures = input.packs.get(pack.kindKey)
      if (!figures) return false
      busy[chargerIndex]![slot] = true
      charging.set(pack.kindKey, (charging.get(pack.kindKey) ?? 0) + 1)
      longestQueueMinutes = Math.max(longestQueueMinutes, minute - pack.queuedMinute)
      const offMinute = minute + 60 * chargeHoursToFull(figures, pack.socPct, charger.powerW)
      const session: PoolSession = {
        chargerIndex,
        slot: slot + 1,
        kindKey: pack.kindKey,
        packNumber: pack.packNumber,
        queuedMinute: pack.queuedMinute,
        onMinute: minute,
        offMinute: offMinute <= input.endMinute ? offMinute : null,
        fromSocPct: pack.socPct,
      }
      sessions.push(session)
      if (session.offMinute !== null) {
        at(offMinute, Order.Full, () => {
          busy[chargerIndex]![slot] = false
          charging.set(pack.kindKey, (charging.get(pack.kindKey) ?? 1) - 1)
          putInBox(pack.kindKey, pack.packNumber)
          startCharges(offMinute)
        })
      }
      return true
    }
    return false
  }

  const release = (kindKey: string, turn: ServedTurn) => {
    // A pack back after the last rig has finished waits for the charger at home.
    if (turn.endMinute >= input.endMinute) return
    if (turn.endSocPct >= FULL_ENOUGH_PCT) {
      putInBox(kindKey, turn.packNumber)
      return
    }
    waiting.push({
      kindKey,
      packNumber: turn.packNumber,
      queuedMinute: turn.endMinute,
      socPct: turn.endSocPct,
    })
    startCharges(turn.endMinute)
  }

  const need = (demandIndex: number, turnIndex: number) => {
    const demand = input.demands[demandIndex]!
    const outcome = outcomes[demandIndex]!
    const turn = demand.turns[turnIndex]!
    const packs = box.get(demand.kindKey) ?? []
    const packNumber = packs.shift()
    if (packNumber === undefined) {
      outcome.shortAtMinute = turn.startMinute
      outcome.waitedOnCharger =
        (charging.get(demand.kindKey) ?? 0) > 0 ||
        waiting.some((pack) => pack.kindKey === demand.kindKey)
      return
    }
    const served = { ...turn, packNumber }
    outcome.served.push(served)
    at(turn.endMinute, Order.Release, () => release(demand.kindKey, served))
    if (turnIndex + 1 < demand.turns.length) {
      at(demand.turns[turnIndex + 1]!.startMinute, Order.Need, () =>
        need(demandIndex, turnIndex + 1),
      )
    }
  }

  for (const [demandIndex, demand] of input.demands.entries()) {
    if (demand.turns.length > 0)
      at(demand.turns[0]!.startMinute, Order.Need, () => need(demandIndex, 0))
  }

  while (queue.length > 0) {
    let next = 0
    for (let index = 1; index < queue.length; index++) {
      const candidate = queue[index]!
      const best = queue[next]!
      if (
        candidate.minute < best.minute ||
        (candidate.minute === best.minute &&
          (candidate.order < best.order ||
            (candidate.order === best.order && candidate.sequence < best.sequence)))
      ) {
        next = index
      }
    }
    const [happening] = queue.splice(next, 1)
    happening!.run()
  }

  // A pack no charger fits is not queuing: it waits for home, and the answer says so apart.
  for (const pack of waiting) {
    if (input.chargers.some((charger) => charger.kindKeys.includes(pack.kindKey))) {
      longestQueueMinutes = Math.max(longestQueueMinutes, input.endMinute - pack.queuedMinute)
    }
  }
  return {
    demands: outcomes,
    sessions,
    neverCharged: waiting.map((pack) => ({ ...pack })),
    longestQueueMinutes,
  }
}
