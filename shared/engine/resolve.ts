// Applies every default to a validated request and lists what was assumed, with its source, so a
// screen can show it (result.assumed). The schema itself applies no defaults.
import type {
  AssumedValue,
  EstimateRequest,
  ScheduleSegment,
  SegmentState,
  SwapPolicy,
} from '../schemas/estimate'
import type { Chemistry } from './chemistry'
import type { PackInputs } from './pack'
import { DEFAULT_CONNECTOR_OHM, leadAreaMm2 } from './leads'
import type { LeadInputs } from './leads'
import type { AmplifierClass } from './amplifier'
import type { AccessoryInputs } from './converters'
import { DEFAULT_BOUNDARY_GAIN_DB, DEFAULT_LISTENER_DISTANCE_M } from './sound'
import { resolveAccessory } from './resolve-accessories'
import { resolveAmplifier } from './resolve-amplifier'
import type { DefaultPicker } from './resolve-assumed'
import { assumptionRecorder } from './resolve-assumed'
import { resolvePack } from './resolve-pack'

export { DEFAULT_HEALTH_PCT, DEFAULT_PACK_COUNT } from './resolve-pack'
export const DEFAULT_TEMPERATURE_C = 25 // common practice: cells and batteries are rated at 25 °C
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

export function resolveRequest(request: EstimateRequest): {
  resolved: ResolvedRequest
  assumed: AssumedValue[]
} {
  // The defaults are taken, and listed in assumed[], in the order of the fields below.
  const { assumed, pick } = assumptionRecorder()
  const programme = resolveProgramme(request.programme, pick)
  const resolved: ResolvedRequest = {
    pack: resolvePack(request.pack, pick),
    leads: request.leads ? resolveLeads(request.leads, pick) : null,
    speakerLeads: request.speakerLeads ? resolveSpeakerLeads(request.speakerLeads) : null,
    amplifier: resolveAmplifier(request.amplifier, pick),
    speakers: resolveSpeakers(request.speakers, request.amplifier.channels, pick),
    accessories: (request.accessories ?? []).map((accessory, index) =>
      resolveAccessory(accessory, index, pick),
    ),
    programme,
    schedule: request.schedule
      ? request.schedule.map((segment) => resolveSegment(segment, programme))
      : null,
    ...resolvePlace(request, pick),
    swapPolicy: resolveSwapPolicy(request.swapPolicy),
  }
  return { resolved, assumed }
}

function resolveProgramme(
  programme: EstimateRequest['programme'],
  pick: DefaultPicker,
): ResolvedRequest['programme'] {
  return {
    crestFactorDb: programme.crestFactorDb,
    peakBelowClipDb: programme.peakBelowClipDb,
    playingPct: pick(
      programme.playingPct,
      'programme.playingPct',
      DEFAULT_PLAYING_PCT,
      'our default: the programme plays all the time unless told',
    ),
  }
}

/** The DC lead from pack to amplifier, with an allowance for its connectors and fuse. */
function resolveLeads(
  leads: NonNullable<EstimateRequest['leads']>,
  pick: DefaultPicker,
): LeadInputs {
  return {
    areaMm2: leadAreaMm2(leads),
    lengthM: leads.lengthM,
    connectorOhm: pick(
      leads.connectorOhm,
      'leads.connectorOhm',
      DEFAULT_CONNECTOR_OHM,
      'from memory: two connectors and a blade fuse',
    ),
  }
}

/** Speaker leads end on speaker terminals, not a fuse: no connector allowance. */
function resolveSpeakerLeads(leads: NonNullable<EstimateRequest['speakerLeads']>): LeadInputs {
  return { areaMm2: leadAreaMm2(leads), lengthM: leads.lengthM, connectorOhm: 0 }
}

function resolveSpeakers(
  speakers: EstimateRequest['speakers'],
  channels: number,
  pick: DefaultPicker,
): ResolvedRequest['speakers'] {
  const driversPerChannel = speakers.parallel * speakers.banks
  return {
    driverOhm: speakers.driverOhm,
    parallel: speakers.parallel,
    banks: speakers.banks,
    sensitivityDb: speakers.sensitivityDb ?? null,
    facingListener: pick(
      speakers.facingListener,
      'speakers.facingListener',
      driversPerChannel * channels,
      'our default: every driver of every channel faces the listener',
    ),
  }
}

/** A segment takes the request's programme for any level it does not give. */
function resolveSegment(
  segment: ScheduleSegment,
  programme: ResolvedRequest['programme'],
): ResolvedSegment {
  return {
    label: segment.label,
    minutes: segment.minutes,
    state: segment.state ?? 'on',
    peakBelowClipDb: segment.peakBelowClipDb ?? programme.peakBelowClipDb,
    crestFactorDb: segment.crestFactorDb ?? programme.crestFactorDb,
    playingPct: segment.playingPct ?? programme.playingPct,
    chargeW: segment.state === 'charging' ? (segment.chargeW ?? 0) : 0,
  }
}

/** The day's weather and the audience: temperature, listener, boundary and children. */
function resolvePlace(
  request: EstimateRequest,
  pick: DefaultPicker,
): Pick<
  ResolvedRequest,
  'temperatureC' | 'listenerDistanceM' | 'boundaryGainDb' | 'childrenPresent'
> {
  return {
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
  }
}

function resolveSwapPolicy(policy: SwapPolicy | undefined): Required<SwapPolicy> {
  return {
    mode: policy?.mode ?? 'when-empty',
    belowSocPct: policy?.belowSocPct ?? DEFAULT_SWAP_BELOW_SOC_PCT,
  }
}
