// The pack model under a constant current, for drawing beside a measured discharge log, and the
// limits a log is read against. Uses the same pack model as the estimate (pack.ts, docs/model.md §1).
import type { PackSpec } from '../schemas/estimate'
import {
  buildPack,
  chargeRateA as packChargeRateA,
  packOpenCircuitV,
  type PackInputs,
} from './pack'
import { DEFAULT_TEMPERATURE_C } from './resolve'
import { assumptionRecorder } from './resolve-assumed'
import { packInputs } from './resolve-pack'

export interface ModelDischargePoint {
  minute: number
  voltageV: number
  deliveredAh: number
}

export interface ModelDischarge {
  points: ModelDischargePoint[]
  deliveredAh: number
  /** Why the model stops: the terminal voltage reached the cutoff, or the charge ran out first. */
  stopReason: 'pack-cutoff' | 'pack-empty'
}

/** A saved pack's fields with the engine's defaults applied, the same as a rig's pack. */
export function packInputsOf(spec: PackSpec): PackInputs {
  // Only the values: the discharge model's answers have no assumed[] to list the defaults in.
  return packInputs(spec, assumptionRecorder().pick)
}

/** What a log of this pack is measured against: cutoff = s × cutoff per cell, rated = p × cell Ah. */
export function dischargeLimitsOf(spec: PackSpec): { cutoffV: number; ratedAh: number } {
  const inputs = packInputsOf(spec)
  return {
    cutoffV: inputs.seriesCells * inputs.cutoffCellV,
    ratedAh: inputs.parallelCells * inputs.cellCapacityAh,
  }
}

// The pack's OCV table has one row per 1 % of charge and is linear between rows, so under a
// constant current the terminal voltage is linear in time between these nodes: the curve and its
// cutoff crossing are exact at this resolution.
const socNodes = 100

/**
 * Terminal voltage V = OCV(state of charge) − I·R while a constant current I drains the pack;
 * charge leaves at the Peukert rate (pack.ts). Stops at the cutoff or when the charge is gone.
 */
export function modelConstantCurrentDischarge(
  spec: PackSpec,
  currentA: number,
  temperatureC = DEFAULT_TEMPERATURE_C,
): ModelDischarge {
  const pack = buildPack(packInputsOf(spec), temperatureC)
  if (!(currentA > 0)) return { points: [], deliveredAh: 0, stopReason: 'pack-empty' }
  const emptyS = (pack.capacityAh * 3600) / packChargeRateA(pack, currentA)
  const sagV = currentA * pack.resistanceOhm
  const at = (timeS: number, voltageV: number): ModelDischargePoint => ({
    minute: timeS / 60,
    voltageV,
    deliveredAh: (currentA * timeS) / 3600,
  })

  const points: ModelDischargePoint[] = []
  let previous = { timeS: 0, voltageV: packOpenCircuitV(pack, 1) - sagV }
  if (previous.voltageV <= pack.cutoffV) {
    return { points: [at(0, previous.voltageV)], deliveredAh: 0, stopReason: 'pack-cutoff' }
  }
  points.push(at(previous.timeS, previous.voltageV))
  for (let node = 1; node <= socNodes; node += 1) {
    const timeS = (emptyS * node) / socNodes
    const voltageV = packOpenCircuitV(pack, 1 - node / socNodes) - sagV
    if (voltageV <= pack.cutoffV) {
      const fraction = (previous.voltageV - pack.cutoffV) / (previous.voltageV - voltageV)
      const crossingS = previous.timeS + fraction * (timeS - previous.timeS)
      points.push(at(crossingS, pack.cutoffV))
      return { points, deliveredAh: (currentA * crossingS) / 3600, stopReason: 'pack-cutoff' }
    }
    points.push(at(timeS, voltageV))
    previous = { timeS, voltageV }
  }
  return { points, deliveredAh: (currentA * emptyS) / 3600, stopReason: 'pack-empty' }
}

export interface LogCalibration {
  /** Delivered Ah over what a new pack (health 100 %) of this spec delivers in the same run. */
  healthPct: number
  /** What the model of a new pack delivers at the log's current and temperature, to its cutoff. */
  newPackAh: number
  /** What the model delivers with `healthPct` applied: the log's own Ah, within the solve's tolerance. */
  calibratedAh: number
  currentA: number
  temperatureC: number
}

// A new pack's figure starts the search; a few secant steps absorb anything in the model that is
// not proportional to health (a resistance that rises as health falls, a cutoff reached early).
const calibrationSteps = 8
const calibrationToleranceAh = 1e-6

/**
 * State of health from a measured discharge (docs/estimate-api.md, "Discharge logs"): the
 * health at which the model of this pack, run at the log's average current and temperature down
 * to the log's cutoff, delivers what the log delivered. Measuring against the model of a new pack
 * (not the label's Ah) keeps the rate loss (I·R sag and Peukert) from being counted twice once the
 * figure is applied. Undefined when a new pack of this spec delivers nothing at that current.
 */
export function calibrateFromLog(
  spec: PackSpec,
  log: { deliveredAh: number; averageCurrentA: number; cutoffV: number },
  temperatureC = DEFAULT_TEMPERATURE_C,
): LogCalibration | undefined {
  const currentA = log.averageCurrentA
  if (!(currentA > 0) || !(log.deliveredAh > 0)) return undefined
  // The log was read against this cutoff; the model stops at the same voltage.
  const cutoffCellV = log.cutoffV / spec.seriesCells
  const deliveredAt = (healthPct: number) =>
    modelConstantCurrentDischarge({ ...spec, cutoffCellV, healthPct }, currentA, temperatureC)
      .deliveredAh
  const newPackAh = deliveredAt(100)
  if (!(newPackAh > 0)) return undefined

  let healthPct = (100 * log.deliveredAh) / newPackAh
  let modelAh = deliveredAt(healthPct)
  let previous = { healthPct: 100, modelAh: newPackAh }
  for (let step = 0; step < calibrationSteps; step += 1) {
    const errorAh = modelAh - log.deliveredAh
    if (Math.abs(errorAh) < calibrationToleranceAh) break
    const slope = (modelAh - previous.modelAh) / (healthPct - previous.healthPct)
    if (!(Math.abs(slope) > 0) || !Number.isFinite(slope)) break
    previous = { healthPct, modelAh }
    healthPct = Math.max(healthPct - errorAh / slope, 1e-3)
    modelAh = deliveredAt(healthPct)
  }
  return { healthPct, newPackAh, calibratedAh: modelAh, currentA, temperatureC }
}
