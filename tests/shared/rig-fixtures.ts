// Invented rigs for the engine tests (no real products).
import { estimateRequestSchema } from '../../shared/schemas/estimate'
import type {
  EstimateRequest,
  EstimateRequestInput as RequestInput,
} from '../../shared/schemas/estimate'

/** A market-stage column: a "20 V max" tool pack, a bridged class D board, two 3 × 8 ohm banks. */
export function columnRig(): EstimateRequest {
  return estimateRequestSchema.parse({
    pack: {
      chemistry: 'li-ion',
      seriesCells: 5,
      parallelCells: 2,
      cellCapacityAh: 2.5,
      maxDischargeA: 20,
      count: 3,
    },
    leads: { awg: 16, lengthM: 1 },
    amplifier: {
      class: 'd',
      bridged: true,
      channels: 2,
      ratedPowerW: 50,
      ratedLoadOhm: 4,
      ratedSupplyV: 21,
      supplyMinV: 8,
      supplyMaxV: 26,
    },
    speakers: { driverOhm: 8, parallel: 3, banks: 2, sensitivityDb: 86 },
    accessories: [{ label: 'Receiver', powerW: 2, inputMinV: 4.75, inputMaxV: 5.25, feed: 'buck' }],
    programme: { crestFactorDb: 12, peakBelowClipDb: 3 },
  } satisfies RequestInput)
}

/** Parse a variant of a request, so every test input is one the schema accepts. */
export function variant(base: EstimateRequest, change: Partial<RequestInput>): EstimateRequest {
  return estimateRequestSchema.parse({ ...base, ...change })
}

/**
 * A constant-current load: a class AB amplifier that plays nothing draws only its idle current,
 * whatever the supply voltage, so hand calculations in Ah apply directly.
 */
export function constantCurrentRig(
  pack: RequestInput['pack'],
  currentA: number,
  extra: Partial<RequestInput> = {},
): EstimateRequest {
  return estimateRequestSchema.parse({
    pack,
    amplifier: {
      class: 'ab',
      bridged: true,
      channels: 1,
      ratedPowerW: 10,
      ratedLoadOhm: 8,
      ratedSupplyV: 14,
      idleCurrentA: currentA,
    },
    speakers: { driverOhm: 8, parallel: 1, banks: 1 },
    programme: { crestFactorDb: 12, peakBelowClipDb: 6, playingPct: 0 },
    ...extra,
  } satisfies RequestInput)
}

/** A 4S4P pack of 2.5 Ah li-ion cells: 10 Ah with no rate effect, so hand sums in Ah apply. */
export const TEN_AH_PACK = {
  chemistry: 'li-ion',
  seriesCells: 4,
  parallelCells: 4,
  cellCapacityAh: 2.5,
  peukertExponent: 1,
} as const satisfies RequestInput['pack']
