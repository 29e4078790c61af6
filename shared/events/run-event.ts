// The answer for an event: each plan's day from the engine, then the pool of packs and the
// chargers over the whole day (pool.ts), the fewest packs to bring, and the pool's charge.
import { estimate } from '../engine/estimate'
import { CHEMISTRY_DATA } from '../engine/chemistry'
import { onEventClock } from '../engine/moment'
import { DEFAULT_TEMPERATURE_C } from '../engine/resolve'
import { ENGINE_VERSION } from '../engine/version'
import { minutesAfterMidnight, clockLabel } from '../plans/clock'
import type { EstimateRequest, EstimateResult, Severity } from '../schemas/estimate'
import type {
  EventAnswer,
  EventBody,
  EventCaution,
  EventKindAnswer,
  EventRigAnswer,
  EventSummary,
} from '../schemas/events'
import { chargingPermitted, type ChargeablePack } from '../engine/charging'
import { packKindOf, type PackKind } from './pack-kinds'
import { simulatePool, type PoolCharger, type PoolDemand, type PoolOutcome } from './pool'
import { poolChargeSeries } from './pool-charge'

/** A saved plan as the event runs it: its rig's request with the plan's day in it. */
export interface EventPlanInput {
  planId: number
  planName: string
  rigName: string
  startTime: string
  request: EstimateRequest
}

// The schema's limit on packs on hand: the engine is asked for the day with this many, so it
// swaps whenever a pack is done and says how many turns the day takes.
const ENOUGH_PACKS = 50

const severityRank: Record<Severity, number> = { info: 0, caution: 1, danger: 2 }

interface PlanRun {
  input: EventPlanInput
  result: EstimateResult
  kind: PackKind
  charge: ChargeablePack
  startMinute: number
  demand: PoolDemand
}

function runPlan(input: EventPlanInput): PlanRun {
  const request = { ...input.request, pack: { ...input.request.pack, count: ENOUGH_PACKS } }
  const result = estimate(request)
  const startMinute = minutesAfterMidnight(input.startTime)
  const healthPct = input.request.pack.healthPct ?? 100
  return {
    input,
    result,
    kind: packKindOf(input.request.pack),
    charge: {
      chemistry: input.request.pack.chemistry,
      seriesCells: input.request.pack.seriesCells,
      capacityAh: (result.pack.ratedCapacityAh * healthPct) / 100,
    },
    startMinute,
    demand: {
      kindKey: packKindOf(input.request.pack).key,
      turns: result.packRuns.map((run) => ({
        startMinute: startMinute + run.startMinute,
        endMinute: startMinute + run.endMinute,
        endSocPct: Math.max(0, Math.min(100, run.lowestSocPct)),
      })),
    },
  }
}

function lastsOnItsOwn(run: PlanRun): boolean {
  return run.result.schedule?.lasts ?? false
}

function everyRigServed(runs: readonly PlanRun[], outcome: PoolOutcome): boolean {
  return runs.every(
    (run, index) => !lastsOnItsOwn(run) || outcome.demands[index]!.shortAtMinute === null,
  )
}

/** Charging figures per kind: the largest pack of a kind (the longest charge) stands for it. */
function kindFigures(runs: readonly PlanRun[]) {
  const kinds = new Map<string, { kind: PackKind; charge: ChargeablePack; turns: number }>()
  for (const run of runs) {
    const known = kinds.get(run.kind.key)
    if (!known) {
      kinds.set(run.kind.key, {
        kind: run.kind,
        charge: run.charge,
        turns: run.demand.turns.length,
      })
      continue
    }
    known.turns += run.demand.turns.length
    if (run.charge.capacityAh > known.charge.capacityAh) known.charge = run.charge
  }
  return kinds
}

/**
 * The venue's air as the plans give it: an event has no temperature of its own, so each plan's
 * (else its rig's, else the engine's default) stands for the air at the chargers in its part of
 * the day. Not knowing which hours are colder, the chargers must suit the coldest and the hottest.
 */
interface VenueAir {
  coldestC: number
  hottestC: number
}

/**
 * Where a kind may not be charged at the venue, the temperature that forbids it (charging.ts,
 * chargingPermitted: one range per chemistry, ends included); null where it may be charged.
 */
function chargeRefusedAtC(kind: PackKind, air: VenueAir): number | null {
  if (!chargingPermitted(kind.chemistry, air.coldestC)) return air.coldestC
  if (!chargingPermitted(kind.chemistry, air.hottestC)) return air.hottestC
  return null
}

/**
 * The fewest packs of each kind, all brought charged, with which every rig that lasts on its
 * own still lasts, searched below `upperCounts` (a pool known to last). Kinds are settled one
 * after another (a kind's packs that charge on a shared charger can hold up another kind);
 * adding packs never makes the pool fail, so each kind's count is found by halving.
 */
function fewestToBring(
  runs: readonly PlanRun[],
  simulate: (counts: ReadonlyMap<string, number>) => PoolOutcome,
  upperCounts: ReadonlyMap<string, number>,
): Map<string, number> {
  const counts = new Map(upperCounts)
  for (const [kindKey, upper] of upperCounts) {
    let low = 0
    let high = upper
    while (low < high) {
      const middle = Math.floor((low + high) / 2)
      counts.set(kindKey, middle)
      if (everyRigServed(runs, simulate(counts))) high = middle
      else low = middle + 1
    }
    counts.set(kindKey, high)
  }
  return counts
}

function engineStopReason(run: PlanRun): string {
  const stoppedAt = run.result.schedule?.stoppedAtMinute ?? run.result.runtimeHours * 60
  const at = clockLabel('00:00', run.startMinute + stoppedAt)
  return `The plan "${run.input.planName}" stops at ${at} even with a charged pack at every swap (${run.result.stopReason}). Open the plan and fix the rig first; more packs will not help.`
}

export function runEvent(
  plans: readonly EventPlanInput[],
  body: Pick<EventBody, 'pool' | 'chargers'>,
): EventAnswer {
  if (plans.length === 0) return emptyAnswer()
  const runs = plans.map(runPlan)
  const figures = kindFigures(runs)
  const planTemperaturesC = plans.map((plan) => plan.request.temperatureC ?? DEFAULT_TEMPERATURE_C)
  const air: VenueAir = {
    coldestC: Math.min(...planTemperaturesC),
    hottestC: Math.max(...planTemperaturesC),
  }
  const cautions: EventCaution[] = []
  const startMinute = Math.min(...runs.map((run) => run.startMinute))
  const endMinute = Math.max(
    ...runs.map((run) => run.startMinute + (run.result.schedule?.totalMinutes ?? 0)),
  )

  const chargers: PoolCharger[] = body.chargers.map((charger) => ({
    powerW: charger.powerW,
    slots: charger.slots,
    kindKeys: charger.packKinds.filter((key) => {
      const known = figures.get(key)
      return known !== undefined && chargeRefusedAtC(known.kind, air) === null
    }),
  }))
  const packs = new Map([...figures].map(([key, known]) => [key, known.charge]))
  const simulate = (counts: ReadonlyMap<string, number>) =>
    simulatePool({ demands: runs.map((run) => run.demand), packs, counts, chargers, endMinute })

  const onHand = new Map<string, number>()
  for (const key of figures.keys()) onHand.set(key, 0)
  for (const entry of body.pool) if (figures.has(entry.kind)) onHand.set(entry.kind, entry.count)
  const outcome = simulate(onHand)
  // One charged pack per turn always lasts; the crew's own pool is the bound when it lasts too.
  const upper = everyRigServed(runs, outcome)
    ? onHand
    : new Map(
        [...figures].map(([key, known]) => [key, Math.max(known.turns, onHand.get(key) ?? 0)]),
      )
  const toBring = fewestToBring(runs, simulate, upper)

  const rigs: EventRigAnswer[] = runs.map((run, index) => {
    const served = outcome.demands[index]!
    // A danger's moment on the plan's clock ("at about 12:00"), as the plan's card says it.
    const dangers = run.result.warnings
      .filter((warning) => warning.severity === 'danger')
      .map((warning) => onEventClock(warning, (minute) => clockLabel(run.input.startTime, minute)))
    let worst: Severity | null = null
    for (const warning of run.result.warnings) {
      if (worst === null || severityRank[warning.severity] > severityRank[worst])
        worst = warning.severity
    }
    const ownLasts = lastsOnItsOwn(run)
    let stopReason: string | null = null
    let stopsAtMinute: number | null = null
    if (served.shortAtMinute !== null) {
      stopsAtMinute = served.shortAtMinute
      const nextCharged = outcome.sessions
        .filter((session) => session.kindKey === run.kind.key && session.offMinute !== null)
        .map((session) => session.offMinute!)
        .filter((minute) => minute > served.shortAtMinute!)
        .sort((a, b) => a - b)[0]
      const at = clockLabel('00:00', served.shortAtMinute)
      stopReason = served.waitedOnCharger
        ? `At ${at} no charged ${run.kind.label} is left: the next comes off a charger ${nextCharged === undefined ? 'after the day ends' : `at ${clockLabel('00:00', nextCharged)}`}. Bring more packs of this kind charged, or add a charger for it.`
        : `At ${at} no charged ${run.kind.label} is left and none is charging. Bring more packs of this kind charged, or add a charger that fits it.`
    } else if (!ownLasts) {
      stopsAtMinute = run.startMinute + (run.result.schedule?.stoppedAtMinute ?? 0)
      stopReason = engineStopReason(run)
    }
    return {
      planId: run.input.planId,
      planName: run.input.planName,
      rigName: run.input.rigName,
      kindKey: run.kind.key,
      startMinute: run.startMinute,
      endMinute: run.startMinute + (run.result.schedule?.totalMinutes ?? 0),
      lastsOnItsOwn: ownLasts,
      lasts: ownLasts && served.shortAtMinute === null && dangers.length === 0,
      stopsAtMinute,
      stopReason,
      worstSeverity: worst,
      dangers,
      turns: served.served.map((turn) => ({
        packName: `${run.kind.label} #${turn.packNumber}`,
        packNumber: turn.packNumber,
        startMinute: turn.startMinute,
        endMinute: turn.endMinute,
        endSocPct: turn.endSocPct,
      })),
      swapMinutes: served.served.slice(1).map((turn) => turn.startMinute),
    }
  })

  const kinds: EventKindAnswer[] = [...figures].map(([key, known]) => ({
    key,
    label: known.kind.label,
    onHand: onHand.get(key) ?? 0,
    toBring: toBring.get(key) ?? 0,
    turns: known.turns,
    nominalWh: known.charge.capacityAh * known.kind.nominalV,
    isLithium: known.kind.isLithium,
  }))

  cautions.push(...eventCautions(body, figures, kinds, air, outcome))

  const sessions = outcome.sessions.map((session) => ({
    chargerIndex: session.chargerIndex,
    chargerLabel: body.chargers[session.chargerIndex]?.label ?? '',
    slot: session.slot,
    packName: `${figures.get(session.kindKey)?.kind.label ?? session.kindKey} #${session.packNumber}`,
    kindKey: session.kindKey,
    queuedMinute: session.queuedMinute,
    onMinute: session.onMinute,
    offMinute: session.offMinute,
    fromSocPct: session.fromSocPct,
  }))

  return {
    engineVersion: ENGINE_VERSION,
    lasts: rigs.every((rig) => rig.lasts),
    startMinute,
    endMinute,
    rigs,
    kinds,
    sessions,
    chargersKeepUp: outcome.demands.every((demand) => !demand.waitedOnCharger),
    longestQueueMinutes: outcome.longestQueueMinutes,
    unchargedAtEnd:
      outcome.neverCharged.length +
      outcome.sessions.filter((session) => session.offMinute === null).length,
    pool: poolChargeSeries({
      startMinute,
      endMinute,
      kinds: kinds.map((kind) => ({
        key: kind.key,
        count: kind.onHand,
        nominalWh: kind.nominalWh,
      })),
      packs,
      chargers,
      outcome,
    }),
    cautions,
    coldestC: air.coldestC,
  }
}

function emptyAnswer(): EventAnswer {
  return {
    engineVersion: ENGINE_VERSION,
    lasts: false,
    startMinute: 0,
    endMinute: 0,
    rigs: [],
    kinds: [],
    sessions: [],
    chargersKeepUp: true,
    longestQueueMinutes: 0,
    unchargedAtEnd: 0,
    pool: [],
    cautions: [],
    coldestC: DEFAULT_TEMPERATURE_C,
  }
}

function eventCautions(
  body: Pick<EventBody, 'pool' | 'chargers'>,
  figures: ReturnType<typeof kindFigures>,
  kinds: readonly EventKindAnswer[],
  air: VenueAir,
  outcome: PoolOutcome,
): EventCaution[] {
  const cautions: EventCaution[] = []
  const charged = new Set(body.chargers.flatMap((charger) => charger.packKinds))
  for (const kind of kinds) {
    const known = figures.get(kind.key)!.kind
    const refusedAtC = charged.has(kind.key) ? chargeRefusedAtC(known, air) : null
    if (refusedAtC !== null) cautions.push(chargeTemperatureCaution(known, refusedAtC))
    if (kind.onHand < kind.toBring) {
      cautions.push({
        code: 'event-pool-short',
        severity: 'danger',
        message: `${kind.label}: ${kind.toBring} must be brought charged and ${kind.onHand} are on hand. Bring ${kind.toBring - kind.onHand} more, or add charging for this kind.`,
      })
    }
    if (CHEMISTRY_DATA[known.chemistry].label.startsWith('Lead') && charged.has(kind.key)) {
      cautions.push({
        code: 'event-lead-acid-charging-gas',
        severity: 'caution',
        message: `${kind.label}: lead-acid batteries give off hydrogen while charging. Charge them in open air, away from sparks and flames, with a charger made for lead-acid.`,
      })
    }
  }
  const known = new Set(figures.keys())
  for (const entry of body.pool) {
    if (!known.has(entry.kind) && entry.count > 0) {
      cautions.push({
        code: 'event-pool-kind-unused',
        severity: 'info',
        message: `The pool lists ${entry.count} packs of a kind (${entry.kind}) that none of these plans uses; they are left out.`,
      })
    }
  }
  for (const [index, charger] of body.chargers.entries()) {
    const unknown = charger.packKinds.filter((key) => !known.has(key))
    if (unknown.length === charger.packKinds.length) {
      cautions.push({
        code: 'event-charger-unused',
        severity: 'info',
        message: `Charger ${index + 1} ("${charger.label}") fits no pack kind these plans use, so it charges nothing.`,
      })
    }
  }
  if (outcome.sessions.length > 0) {
    cautions.push({
      code: 'event-charge-assumption',
      severity: 'info',
      message:
        'Charge times assume each charger holds its power up to full. Real chargers slow down near full, so allow extra time; a pack is only handed out when full. Use a charger made for the pack and never leave charging packs unattended.',
    })
  }
  return cautions
}

/** The headline a list shows. */
export function eventSummary(answer: EventAnswer): EventSummary {
  let worst: Severity | null = null
  const severities = [
    ...answer.cautions.map((caution) => caution.severity),
    ...answer.rigs
      .map((rig) => rig.worstSeverity)
      .filter((value): value is Severity => value !== null),
  ]
  for (const severity of severities) {
    if (worst === null || severityRank[severity] > severityRank[worst]) worst = severity
  }
  return {
    engineVersion: answer.engineVersion,
    lasts: answer.lasts,
    rigCount: answer.rigs.length,
    packsToBring: answer.kinds.map((kind) => ({
      kind: kind.key,
      label: kind.label,
      count: kind.toBring,
      onHand: kind.onHand,
    })),
    worstSeverity: worst,
  }
}

/**
 * A kind kept off the chargers at `refusedAtC`, in plain words: why, what the answer did, and
 * what to change. Lithium keeps the code it has always had; other chemistries get their own.
 */
function chargeTemperatureCaution(kind: PackKind, refusedAtC: number): EventCaution {
  const range = CHEMISTRY_DATA[kind.chemistry].chargeTemperatureC!
  const cold = refusedAtC < range.minC
  const fix = cold
    ? `Charge them indoors, or warm them to above ${range.minC} °C before they go on a charger`
    : `Charge them where it is below ${range.maxC} °C, in the shade`
  return {
    code: kind.isLithium ? 'event-lithium-charge-temperature' : 'event-charge-temperature',
    severity: 'danger',
    message: `${kind.label}: these packs must not be charged at ${refusedAtC} °C, the ${cold ? 'coldest' : 'hottest'} temperature among these plans (makers allow ${range.minC} to ${range.maxC} °C). The answer keeps them off the chargers all day, so the packs to bring count no charge for them. ${fix}, or bring more charged.`,
  }
}
