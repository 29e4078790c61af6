// Applies every default to a validated request and lists what was assumed, with its source, so a
// screen can show it (result.assumed). The schema itself applies no defaults.
import type { AssumedValue, EstimateRequest, SegmentState, SwapPolicy } from '../schemas/estimate'
import { CHEMISTRY_DATA, defaultCellResistanceOhm } from './chemistry'
import type { Chemistry } from './chemistry'
import type { PackInputs } from './pack'
import { ageingResistanceFactor } from './pack'
import { DEFAULT_CONNECTOR_OHM, leadAreaMm2 } from './leads'
import type { LeadInputs } from './leads'
import {
  DEFAULT_CLASS_A_EFFICIENCY,
  DEFAULT_CLASS_AB_IDLE_CURRENT_A,
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
export const DEFAULT_PLAYING_PCT = 100 // ours: playing all the time unless told
export const DEFAULT_SWAP_BELOW_SOC_PCT = 30 // ours: swap at a break once a pack is below 30 %

export interface ResolvedSegment {
  label: string
  minutes: number
  state: SegmentState
  peakBelowClipDb: number
  crestFactorDb: number
  playingPct: number
  /** Power into the pack in a 'charging' segment; 0 in the others. */
  chargeW: number
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
  /** Per channel, amplifier to speakers; no connector allowance (speaker terminals, not a fuse). */
  speakerLeads: LeadInputs | null
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
    /** Bulk supply capacitance; 0 when not given (none is taken: the safe side). */
    bulkCapacitanceF: number
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

type Pick = <T extends number | string | boolean>(
  given: T | undefined,
  field: string,
  fallback: T,
  source: string,
) => T

/** The input range the pack's voltage reaches for this accessory (AccessoryInputs.exposedInput). */
function exposedInput(
  accessory: NonNullable<EstimateRequest['accessories']>[number],
  index: number,
  pick: Pick,
): AccessoryInputs['exposedInput'] {
  if (accessory.feed === 'direct') return { minV: accessory.inputMinV, maxV: accessory.inputMaxV }
  const { converterInputMinV, converterInputMaxV } = accessory
  if (converterInputMinV !== undefined || converterInputMaxV !== undefined) {
    return { minV: converterInputMinV ?? 0, maxV: converterInputMaxV ?? Number.MAX_VALUE }
  }
  if (accessory.feed !== 'isolated') return null
  // Safe side: small isolated modules are often unregulated, passing the pack's voltage through
  // in a fixed ratio, so without the module's own range the accessory's range is checked.
  return {
    minV: pick(
      undefined,
      `accessories.${index}.converterInputMinV`,
      accessory.inputMinV,
      "ours, safe side: an isolated module taken as unregulated, so the accessory's range applies",
    ),
    maxV: pick(
      undefined,
      `accessories.${index}.converterInputMaxV`,
      accessory.inputMaxV,
      "ours, safe side: an isolated module taken as unregulated, so the accessory's range applies",
    ),
  }
}

export function resolveRequest(request: EstimateRequest): {
  resolved: ResolvedRequest
  assumed: AssumedValue[]
} {
  const assumed: AssumedValue[] = []
  const pick: Pick = function pick<T extends number | string | boolean>(
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
    'our default: the programme plays all the time unless told',
  )
  const resolvedProgramme = {
    crestFactorDb: programme.crestFactorDb,
    peakBelowClipDb: programme.peakBelowClipDb,
    playingPct: programmePlayingPct,
  }
  const supplyMinV = amplifier.supplyMinV ?? null
  const healthPct = pick(
    pack.healthPct,
    'pack.healthPct',
    DEFAULT_HEALTH_PCT,
    'our default: as labelled',
  )
  const driversPerChannel = speakers.parallel * speakers.banks

  const resolved: ResolvedRequest = {
    pack: {
      chemistry: pack.chemistry,
      seriesCells: pack.seriesCells,
      parallelCells: pack.parallelCells,
      cellCapacityAh: pack.cellCapacityAh,
      cellResistanceOhm:
        pack.cellResistanceOhm ??
        pick(
          undefined,
          'pack.cellResistanceOhm',
          defaultCellResistanceOhm(pack.chemistry, pack.cellCapacityAh) *
            ageingResistanceFactor(healthPct),
          `from memory: typical ${chemistry.label} cell, ${chemistry.resistanceOhmAh} ohm·Ah over the cell capacity${healthPct < 100 ? `, raised for ${healthPct} % health (doubles at 80 %, common practice)` : ''}`,
        ),
      cutoffCellV: pick(
        pack.cutoffCellV,
        'pack.cutoffCellV',
        chemistry.cutoffCellV,
        `common practice for ${chemistry.label}`,
      ),
      healthPct,
      peukertExponent: pick(
        pack.peukertExponent,
        'pack.peukertExponent',
        chemistry.peukertExponent,
        pack.chemistry === 'lead-acid'
          ? 'common practice: lead-acid k ≈ 1.1–1.3'
          : chemistry.isLithium
            ? 'no Peukert for lithium: the I·R sag and a small rate loss from makers’ curves'
            : 'from memory',
      ),
      // A Peukert exponent given by the user carries the whole rate effect.
      rateLossPerC: pack.peukertExponent === undefined ? chemistry.rateLossPerC : 0,
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
    speakerLeads: request.speakerLeads
      ? {
          areaMm2: leadAreaMm2(request.speakerLeads),
          lengthM: request.speakerLeads.lengthM,
          connectorOhm: 0,
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
        'common practice: headline ratings are usually 10 % THD figures',
      ),
      supplyMinV,
      supplyMaxV: amplifier.supplyMaxV ?? null,
      // Not given: none taken, the safe side for dropouts (a bass note outlasts the capacitors).
      bulkCapacitanceF: (amplifier.bulkCapacitanceUF ?? 0) * 1e-6,
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
              amplifierClass === 'ab' ? DEFAULT_CLASS_AB_IDLE_CURRENT_A : DEFAULT_IDLE_CURRENT_A,
              amplifierClass === 'ab'
                ? 'from memory: class AB power chips idle at 0.1–0.25 A'
                : 'from memory: small class D boards idle at 20–80 mA',
            ),
      efficiency:
        amplifierClass === 'ab'
          ? 1 // class AB efficiency follows from the supply and the swing (docs/estimate-api.md)
          : pick(
              amplifier.efficiency,
              'amplifier.efficiency',
              efficiencyFallback,
              amplifierClass === 'a'
                ? 'Boylestad & Nashelsky ch. 12: series-fed class A at most 25 %'
                : 'from memory: small class D boards convert about 88 % at useful output',
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
      exposedInput: exposedInput(accessory, index, pick),
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
          chargeW: segment.state === 'charging' ? (segment.chargeW ?? 0) : 0,
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
      'our default: free field unless a boundary is given',
    ),
    childrenPresent: request.childrenPresent ?? false,
    swapPolicy: {
      mode: request.swapPolicy?.mode ?? 'when-empty',
      belowSocPct: request.swapPolicy?.belowSocPct ?? DEFAULT_SWAP_BELOW_SOC_PCT,
    },
  }
  return { resolved, assumed }
}
