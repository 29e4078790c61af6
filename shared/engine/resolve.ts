// Applies every default to a validated request and lists what was assumed, with its source, so a
// screen can show it (result.assumed). The schema itself applies no defaults.
import type { AssumedValue, EstimateRequest, SegmentState, SwapPolicy } from '../schemas/estimate'
import { CHEMISTRY_DATA, defaultCellResistanceOhm } from './chemistry'
import type { Chemistry } from './chemistry'
import type { PackInputs } from './pack'
import { DEFAULT_CONNECTOR_OHM, leadAreaMm2 } from './leads'
import type { LeadInputs } from './leads'
import {
  DEFAULT_CLASS_A_EFFICIENCY,
  DEFAULT_CLASS_D_EFFICIENCY,
  DEFAULT_IDLE_CURRENT_A,
  DEFAULT_RATED_THD_PCT,
} from './amplifier'
import type { AmplifierClass } from './amplifier'
import { DEFAULT_CONVERTER_EFFICIENCY, DEFAULT_CONVERTER_IDLE_W } from './converters'
import type { AccessoryInputs } from './converters'
import { DEFAULT_BOUNDARY_GAIN_DB, DEFAULT_LISTENER_DISTANCE_M } from './sound'

export const DEFAULT_TEMPERATURE_C = 25 // common practice: cells and batteries are rated at 25 °C
export const DEFAULT_HEALTH_PCT = 100 // ours: a pack as labelled until a discharge log says otherwise
export const DEFAULT_PACK_COUNT = 1
export const DEFAULT_PLAYING_PCT = 100 // engine.md §9
export const DEFAULT_SWAP_BELOW_SOC_PCT = 30 // ours: swap at a break once a pack is below 30 %

export interface ResolvedSegment {
  label: string
  minutes: number
  state: SegmentState
  peakBelowClipDb: number
  crestFactorDb: number
  playingPct: number
}

export interface ResolvedRequest {
  pack: PackInputs & {
    chemistry: Chemistry
    count: number
    maxDischargeA: number | null
    label?: string | undefined
    massKg?: number | undefined
    price?: number | undefined
  }
  leads: LeadInputs | null
  amplifier: {
    ampClass: AmplifierClass
    bridged: boolean
    channels: number
    ratedPowerW: number
    ratedLoadOhm: number
    ratedSupplyV: number
    ratedThdPct: number
    supplyMinV: number | null
    supplyMaxV: number | null
    lockoutV: number | null
    idleCurrentA: number
    efficiency: number
    minLoadOhm: number
    efficiencyGiven: boolean
  }
  speakers: {
    driverOhm: number
    parallel: number
    banks: number
    sensitivityDb: number | null
    facingListener: number
  }
  accessories: AccessoryInputs[]
  /** The request's programme: used without a schedule and where a segment gives no level. */
  programme: { crestFactorDb: number; peakBelowClipDb: number; playingPct: number }
  schedule: ResolvedSegment[] | null
  temperatureC: number
  listenerDistanceM: number
  boundaryGainDb: number
  childrenPresent: boolean
  swapPolicy: Required<SwapPolicy>
}

export function resolveRequest(request: EstimateRequest): {
  resolved: ResolvedRequest
  assumed: AssumedValue[]
} {
  const assumed: AssumedValue[] = []
  function pick<T extends number | string | boolean>(
    given: T | undefined,
    field: string,
    fallback: T,
    source: string,
  ): T {
    if (given !== undefined) return given
    assumed.push({ field, value: fallback, source })
    return fallback
  }

  const { pack, amplifier, speakers, programme } = request
  const chemistry = CHEMISTRY_DATA[pack.chemistry]
  const amplifierClass = amplifier.class
  const efficiencyFallback =
    amplifierClass === 'a' ? DEFAULT_CLASS_A_EFFICIENCY : DEFAULT_CLASS_D_EFFICIENCY
  const programmePlayingPct = pick(
    programme.playingPct,
    'programme.playingPct',
    DEFAULT_PLAYING_PCT,
    'our default',
  )
  const resolvedProgramme = {
    crestFactorDb: programme.crestFactorDb,
    peakBelowClipDb: programme.peakBelowClipDb,
    playingPct: programmePlayingPct,
  }
  const supplyMinV = amplifier.supplyMinV ?? null
  const driversPerChannel = speakers.parallel * speakers.banks

  const resolved: ResolvedRequest = {
    pack: {
      chemistry: pack.chemistry,
      seriesCells: pack.seriesCells,
      parallelCells: pack.parallelCells,
      cellCapacityAh: pack.cellCapacityAh,
      cellResistanceOhm: pick(
        pack.cellResistanceOhm,
        'pack.cellResistanceOhm',
        defaultCellResistanceOhm(pack.chemistry, pack.cellCapacityAh),
        `from memory: typical ${chemistry.label} cell, ${chemistry.resistanceOhmAh} ohm·Ah over the cell capacity`,
      ),
      cutoffCellV: pick(
        pack.cutoffCellV,
        'pack.cutoffCellV',
        chemistry.cutoffCellV,
        `common practice for ${chemistry.label}`,
      ),
      healthPct: pick(
        pack.healthPct,
        'pack.healthPct',
        DEFAULT_HEALTH_PCT,
        'our default: as labelled',
      ),
      peukertExponent: pick(
        pack.peukertExponent,
        'pack.peukertExponent',
        chemistry.peukertExponent,
        pack.chemistry === 'lead-acid'
          ? 'common practice: k ≈ 1.1–1.3 for lead-acid'
          : 'from memory',
      ),
      count: pick(pack.count, 'pack.count', DEFAULT_PACK_COUNT, 'our default: one pack'),
      maxDischargeA: pack.maxDischargeA ?? null,
      label: pack.label,
      massKg: pack.massKg,
      price: pack.price,
    },
    leads: request.leads
      ? {
          areaMm2: leadAreaMm2(request.leads),
          lengthM: request.leads.lengthM,
          connectorOhm: pick(
            request.leads.connectorOhm,
            'leads.connectorOhm',
            DEFAULT_CONNECTOR_OHM,
            'from memory: two connectors and a blade fuse',
          ),
        }
      : null,
    amplifier: {
      ampClass: amplifierClass,
      bridged: amplifier.bridged,
      channels: amplifier.channels,
      ratedPowerW: amplifier.ratedPowerW,
      ratedLoadOhm: amplifier.ratedLoadOhm,
      ratedSupplyV: amplifier.ratedSupplyV,
      ratedThdPct: pick(
        amplifier.ratedThdPct,
        'amplifier.ratedThdPct',
        DEFAULT_RATED_THD_PCT,
        'our default: the rating taken as the clean 1 % THD figure',
      ),
      supplyMinV,
      supplyMaxV: amplifier.supplyMaxV ?? null,
      lockoutV:
        amplifier.lockoutV ??
        (supplyMinV === null
          ? null
          : pick(
              undefined,
              'amplifier.lockoutV',
              supplyMinV,
              'common practice: the lock-out sits at the bottom of the supply range',
            )),
      idleCurrentA:
        amplifierClass === 'a'
          ? 0 // class A: its bias current is its idle draw
          : pick(
              amplifier.idleCurrentA,
              'amplifier.idleCurrentA',
              DEFAULT_IDLE_CURRENT_A,
              'our default',
            ),
      efficiency:
        amplifierClass === 'ab'
          ? 1 // class AB efficiency follows from the supply and the swing (engine.md §4)
          : pick(
              amplifier.efficiency,
              'amplifier.efficiency',
              efficiencyFallback,
              amplifierClass === 'a'
                ? 'Boylestad & Nashelsky ch. 12: series-fed class A at most 25 %'
                : 'our default',
            ),
      efficiencyGiven: amplifier.efficiency !== undefined,
      minLoadOhm: pick(
        amplifier.minLoadOhm,
        'amplifier.minLoadOhm',
        amplifier.ratedLoadOhm,
        'common practice: the rated load is taken as the lowest the maker supports',
      ),
    },
    speakers: {
      driverOhm: speakers.driverOhm,
      parallel: speakers.parallel,
      banks: speakers.banks,
      sensitivityDb: speakers.sensitivityDb ?? null,
      facingListener: pick(
        speakers.facingListener,
        'speakers.facingListener',
        driversPerChannel * amplifier.channels,
        'our default: every driver of every channel faces the listener',
      ),
    },
    accessories: (request.accessories ?? []).map((accessory, index) => ({
      label: accessory.label,
      powerW: accessory.powerW,
      inputMinV: accessory.inputMinV,
      inputMaxV: accessory.inputMaxV,
      feed: accessory.feed,
      outputV:
        accessory.feed === 'direct'
          ? 0
          : pick(
              accessory.outputV,
              `accessories.${index}.outputV`,
              (accessory.inputMinV + accessory.inputMaxV) / 2,
              "our default: the middle of the accessory's input range",
            ),
      efficiency:
        accessory.feed === 'direct' || accessory.feed === 'linear'
          ? 1
          : pick(
              accessory.efficiency,
              `accessories.${index}.efficiency`,
              DEFAULT_CONVERTER_EFFICIENCY[accessory.feed],
              'from memory: typical small converter module',
            ),
      idleW:
        accessory.feed === 'direct' || accessory.feed === 'linear'
          ? 0
          : pick(
              accessory.idleW,
              `accessories.${index}.idleW`,
              DEFAULT_CONVERTER_IDLE_W[accessory.feed],
              'from memory: no-load draw of a small converter module',
            ),
    })),
    programme: resolvedProgramme,
    schedule: request.schedule
      ? request.schedule.map((segment) => ({
          label: segment.label,
          minutes: segment.minutes,
          state: segment.state ?? 'on',
          peakBelowClipDb: segment.peakBelowClipDb ?? resolvedProgramme.peakBelowClipDb,
          crestFactorDb: segment.crestFactorDb ?? resolvedProgramme.crestFactorDb,
          playingPct: segment.playingPct ?? resolvedProgramme.playingPct,
        }))
      : null,
    temperatureC: pick(
      request.temperatureC,
      'temperatureC',
      DEFAULT_TEMPERATURE_C,
      'common practice: batteries are rated at 25 °C',
    ),
    listenerDistanceM: pick(
      request.listenerDistanceM,
      'listenerDistanceM',
      DEFAULT_LISTENER_DISTANCE_M,
      'our default: the front of a small outdoor audience',
    ),
    boundaryGainDb: pick(
      request.boundaryGainDb,
      'boundaryGainDb',
      DEFAULT_BOUNDARY_GAIN_DB,
      'our default: free field, no wall or ground close by',
    ),
    childrenPresent: request.childrenPresent ?? false,
    swapPolicy: {
      mode: request.swapPolicy?.mode ?? 'when-empty',
      belowSocPct: request.swapPolicy?.belowSocPct ?? DEFAULT_SWAP_BELOW_SOC_PCT,
    },
  }
  return { resolved, assumed }
}
