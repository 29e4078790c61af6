// The estimate request and result (docs/model.md §9). Field names are the contract: extend, rename none.
// The schema only validates; defaults are applied by the engine and listed in `result.assumed`,
// so screens can show what was assumed.
import { z } from 'zod'
import { CHEMISTRIES, CHEMISTRY_DATA } from '../engine/chemistry'
import {
  ACCESSORY_FEEDS,
  AMPLIFIER_CLASSES,
  CHOICES,
  FIELDS,
  FLAGS,
  MAX_SCHEDULE_MINUTES,
} from '../fields'
import { fieldLabel, fieldLabelInSentence as inSentence, numberField } from './number-field'
import { singleLineMessage, singleLinePattern } from './single-line'

export function text(label: string, maxLength: number) {
  const message = `${label} must be text of 1 to ${maxLength} characters`
  return z
    .string({ error: message })
    .trim()
    .min(1, { error: message })
    .max(maxLength, { error: message })
    .regex(singleLinePattern, { error: `${label}: ${singleLineMessage.toLowerCase()}` })
}

function choice<const T extends readonly [string, ...string[]]>(label: string, values: T) {
  return z.enum(values, { error: `${label} must be one of: ${values.join(', ')}` })
}

function flag(label: string) {
  return z.boolean({ error: `${label} must be true or false` })
}

export const CHEMISTRY_VALUES = CHEMISTRIES
export { ACCESSORY_FEEDS, AMPLIFIER_CLASSES }
export const SEGMENT_STATES = ['on', 'idle', 'off', 'charging'] as const
export const SWAP_MODES = ['when-empty', 'at-break-below'] as const
export const STOP_REASONS = [
  'pack-cutoff',
  'cannot-deliver',
  'amp-lockout',
  'pack-empty',
  'schedule-end',
  'time-limit', // extension: a run without a schedule is capped at 7 days of simulated time
] as const
export const CONVERTER_VERDICTS = [
  'direct-ok',
  'step-down',
  'step-up',
  'buck-boost',
  'over-max',
] as const
export const AIRLINE_CLASSES = [
  'up-to-100wh',
  '100-to-160wh',
  'over-160wh',
  'not-lithium', // extension: the Wh classes are rules for lithium packs only
] as const
export const SEVERITIES = ['info', 'caution', 'danger'] as const

export const packSchema = z
  .object(
    {
      chemistry: choice(CHOICES['pack.chemistry'].label, CHEMISTRIES),
      seriesCells: numberField('pack.seriesCells'),
      parallelCells: numberField('pack.parallelCells'),
      cellCapacityAh: numberField('pack.cellCapacityAh'),
      cellResistanceOhm: numberField('pack.cellResistanceOhm').optional(),
      cutoffCellV: numberField('pack.cutoffCellV').optional(),
      healthPct: numberField('pack.healthPct').optional(),
      maxDischargeA: numberField('pack.maxDischargeA').optional(),
      peukertExponent: numberField('pack.peukertExponent').optional(),
      count: numberField('pack.count').optional(),
      label: text('Pack name', 80).optional(),
      massKg: numberField('pack.massKg').optional(),
      price: numberField('pack.price').optional(),
    },
    { error: 'Pack is required: chemistry, cells in series and parallel, and cell capacity' },
  )
  .superRefine((pack, context) => {
    const fullCellV = CHEMISTRY_DATA[pack.chemistry].fullCellV
    if (pack.cutoffCellV !== undefined && pack.cutoffCellV >= fullCellV) {
      context.addIssue({
        code: 'custom',
        path: ['cutoffCellV'],
        message: `${fieldLabel('pack.cutoffCellV')} (${pack.cutoffCellV} V) must be below the full-charge voltage of a ${CHEMISTRY_DATA[pack.chemistry].label} cell (${fullCellV.toFixed(2)} V)`,
      })
    }
  })

/**
 * A two-conductor copper run given by its wire size (AWG or mm², exactly one) and one-way length:
 * the DC lead from pack to amplifier (`Lead`) and the speaker leads (`Speaker lead`).
 */
function copperPairSchema(noun: string, run: 'leads' | 'speakerLeads') {
  return z.object(
    {
      awg: numberField(`${run}.awg`).optional(),
      areaMm2: numberField(`${run}.areaMm2`).optional(),
      lengthM: numberField(`${run}.lengthM`),
    },
    { error: `${noun}s must give a wire size (awg or areaMm2) and a one-way length` },
  )
}

/** Exactly one of AWG and mm² (both or neither is ambiguous). */
function oneWireSize(run: 'leads' | 'speakerLeads') {
  const [awg, area] = [`${run}.awg`, `${run}.areaMm2`] as const
  const message = `Give either the ${inSentence(awg)} (${FIELDS[awg].unit}) or the ${inSentence(area)} (${FIELDS[area].unit}), exactly one of them`
  return (
    wire: { awg?: number | undefined; areaMm2?: number | undefined },
    context: z.RefinementCtx,
  ) => {
    if ((wire.awg === undefined) === (wire.areaMm2 === undefined)) {
      context.addIssue({
        code: 'custom',
        path: ['awg'],
        message,
      })
    }
  }
}

export const leadsSchema = copperPairSchema('Lead', 'leads')
  .extend({
    connectorOhm: numberField('leads.connectorOhm').optional(),
  })
  .superRefine(oneWireSize('leads'))

export const speakerLeadsSchema = copperPairSchema('Speaker lead', 'speakerLeads').superRefine(
  oneWireSize('speakerLeads'),
)

export const amplifierSchema = z
  .object(
    {
      class: choice(CHOICES['amplifier.class'].label, AMPLIFIER_CLASSES),
      bridged: flag(FLAGS['amplifier.bridged'].label),
      channels: numberField('amplifier.channels'),
      ratedPowerW: numberField('amplifier.ratedPowerW'),
      ratedLoadOhm: numberField('amplifier.ratedLoadOhm'),
      ratedSupplyV: numberField('amplifier.ratedSupplyV'),
      ratedThdPct: numberField('amplifier.ratedThdPct').optional(),
      supplyMinV: numberField('amplifier.supplyMinV').optional(),
      supplyMaxV: numberField('amplifier.supplyMaxV').optional(),
      lockoutV: numberField('amplifier.lockoutV').optional(),
      idleCurrentA: numberField('amplifier.idleCurrentA').optional(),
      efficiency: numberField('amplifier.efficiency').optional(),
      minLoadOhm: numberField('amplifier.minLoadOhm').optional(),
      bulkCapacitanceUF: numberField('amplifier.bulkCapacitanceUF').optional(),
    },
    {
      error: 'Amplifier is required: class, bridged, channels and its rated power, load and supply',
    },
  )
  .superRefine((amplifier, context) => {
    const { supplyMinV, supplyMaxV, lockoutV, ratedSupplyV } = amplifier
    // Each message names the field it marks and the one it is compared with.
    type Voltage = 'supplyMinV' | 'supplyMaxV' | 'lockoutV' | 'ratedSupplyV'
    const fail = (field: Voltage, relation: string, other: Voltage) =>
      context.addIssue({
        code: 'custom',
        path: [field],
        message: `${fieldLabel(`amplifier.${field}`)} must ${relation} the ${inSentence(`amplifier.${other}`)}`,
      })
    if (supplyMinV !== undefined && supplyMaxV !== undefined && supplyMinV > supplyMaxV) {
      fail('supplyMinV', 'not be above', 'supplyMaxV')
    }
    if (lockoutV !== undefined && supplyMaxV !== undefined && lockoutV >= supplyMaxV) {
      fail('lockoutV', 'be below', 'supplyMaxV')
    }
    if (lockoutV !== undefined && lockoutV >= ratedSupplyV) {
      fail('lockoutV', 'be below', 'ratedSupplyV')
    }
    if (supplyMaxV !== undefined && ratedSupplyV > supplyMaxV) {
      fail('ratedSupplyV', 'not be above', 'supplyMaxV')
    }
    if (supplyMinV !== undefined && ratedSupplyV < supplyMinV) {
      fail('ratedSupplyV', 'not be below', 'supplyMinV')
    }
  })

export const speakersSchema = z.object(
  {
    driverOhm: numberField('speakers.driverOhm'),
    parallel: numberField('speakers.parallel'),
    banks: numberField('speakers.banks'),
    sensitivityDb: numberField('speakers.sensitivityDb').optional(),
    facingListener: numberField('speakers.facingListener').optional(),
  },
  { error: 'Speakers are required: driver impedance, drivers in parallel and banks in series' },
)

export const accessorySchema = z
  .object(
    {
      label: text('Accessory name', 80),
      powerW: numberField('accessory.powerW'),
      inputMinV: numberField('accessory.inputMinV'),
      inputMaxV: numberField('accessory.inputMaxV'),
      feed: choice(CHOICES['accessory.feed'].label, ACCESSORY_FEEDS),
      outputV: numberField('accessory.outputV').optional(),
      efficiency: numberField('accessory.efficiency').optional(),
      idleW: numberField('accessory.idleW').optional(),
      converterInputMinV: numberField('accessory.converterInputMinV').optional(),
      converterInputMaxV: numberField('accessory.converterInputMaxV').optional(),
    },
    { error: 'Each accessory needs a name, power, input range and feed' },
  )
  .superRefine((accessory, context) => {
    const { converterInputMinV, converterInputMaxV } = accessory
    if (
      converterInputMinV !== undefined &&
      converterInputMaxV !== undefined &&
      converterInputMinV > converterInputMaxV
    ) {
      context.addIssue({
        code: 'custom',
        path: ['converterInputMinV'],
        message: `Accessory "${accessory.label}": ${inSentence('accessory.converterInputMinV')} must not be above the ${inSentence('accessory.converterInputMaxV')}`,
      })
    }
    if (accessory.inputMinV > accessory.inputMaxV) {
      context.addIssue({
        code: 'custom',
        path: ['inputMinV'],
        message: `Accessory "${accessory.label}": ${inSentence('accessory.inputMinV')} must not be above the ${inSentence('accessory.inputMaxV')}`,
      })
    } else if (
      accessory.outputV !== undefined &&
      (accessory.outputV < accessory.inputMinV || accessory.outputV > accessory.inputMaxV)
    ) {
      context.addIssue({
        code: 'custom',
        path: ['outputV'],
        message: `Accessory "${accessory.label}": ${inSentence('accessory.outputV')} must lie within the accessory's input range (${accessory.inputMinV}–${accessory.inputMaxV} V)`,
      })
    }
  })

const crestFactorDb = numberField('programme.crestFactorDb')
const peakBelowClipDb = numberField('programme.peakBelowClipDb')
const playingPct = numberField('programme.playingPct')

export const programmeSchema = z.object(
  { crestFactorDb, peakBelowClipDb, playingPct: playingPct.optional() },
  { error: 'Programme is required: crest factor and level (peaks below clipping)' },
)

export const scheduleSegmentSchema = z
  .object(
    {
      label: text('Segment name', 80),
      minutes: numberField('segment.minutes'),
      state: choice('Segment state', SEGMENT_STATES).optional(),
      peakBelowClipDb: peakBelowClipDb.optional(),
      crestFactorDb: crestFactorDb.optional(),
      playingPct: playingPct.optional(),
      chargeW: numberField('segment.chargeW').optional(),
    },
    { error: 'Each schedule segment needs a name and a length in minutes' },
  )
  .superRefine((segment, context) => {
    if (segment.state === 'charging' && segment.chargeW === undefined) {
      context.addIssue({
        code: 'custom',
        path: ['chargeW'],
        message: `Segment "${segment.label}" is a charging break: give the ${inSentence('segment.chargeW')} in ${FIELDS['segment.chargeW'].unit}`,
      })
    }
  })

export const swapPolicySchema = z.object(
  {
    mode: choice('Swap policy', SWAP_MODES),
    belowSocPct: numberField('swapPolicy.belowSocPct').optional(),
  },
  { error: 'Swap policy must give a mode' },
)

export const estimateRequestSchema = z
  .object(
    {
      pack: packSchema,
      leads: leadsSchema.optional(),
      speakerLeads: speakerLeadsSchema.optional(),
      amplifier: amplifierSchema,
      speakers: speakersSchema,
      accessories: z
        .array(accessorySchema, { error: 'Accessories must be a list' })
        .max(20, { error: 'At most 20 accessories' })
        .optional(),
      programme: programmeSchema,
      schedule: z
        .array(scheduleSegmentSchema, { error: 'Schedule must be a list of segments' })
        .min(1, { error: 'A schedule needs at least one segment' })
        .max(200, { error: 'A schedule may have at most 200 segments' })
        .refine(
          (segments) =>
            segments.reduce((total, segment) => total + segment.minutes, 0) <= MAX_SCHEDULE_MINUTES,
          { error: `A schedule may last at most 7 days (${MAX_SCHEDULE_MINUTES} minutes) in all` },
        )
        .optional(),
      temperatureC: numberField('temperatureC').optional(),
      listenerDistanceM: numberField('listenerDistanceM').optional(),
      boundaryGainDb: numberField('boundaryGainDb').optional(),
      childrenPresent: flag(FLAGS.childrenPresent.label).optional(),
      swapPolicy: swapPolicySchema.optional(),
    },
    { error: 'The estimate request must be a JSON object' },
  )
  .superRefine((request, context) => {
    // facingListener counts drivers of all channels, so it cannot exceed the rig's drivers.
    const { speakers, amplifier } = request
    const totalDrivers = speakers.parallel * speakers.banks * amplifier.channels
    if (speakers.facingListener !== undefined && speakers.facingListener > totalDrivers) {
      context.addIssue({
        code: 'custom',
        path: ['speakers', 'facingListener'],
        message: `${fieldLabel('speakers.facingListener')} (${speakers.facingListener}) cannot be more than the rig's ${totalDrivers} drivers (all channels)`,
      })
    }
  })

export type EstimateRequest = z.infer<typeof estimateRequestSchema>
/** What a client may send (before parsing; the same shape, names and optional fields). */
export type EstimateRequestInput = z.input<typeof estimateRequestSchema>
export type PackSpec = z.infer<typeof packSchema>
export type LeadsSpec = z.infer<typeof leadsSchema>
export type SpeakerLeadsSpec = z.infer<typeof speakerLeadsSchema>
export type AmplifierSpec = z.infer<typeof amplifierSchema>
export type SpeakersSpec = z.infer<typeof speakersSchema>
export type AccessorySpec = z.infer<typeof accessorySchema>
export type ProgrammeSpec = z.infer<typeof programmeSchema>
export type ScheduleSegment = z.infer<typeof scheduleSegmentSchema>
export type SwapPolicy = z.infer<typeof swapPolicySchema>
export type SegmentState = (typeof SEGMENT_STATES)[number]
export type StopReason = (typeof STOP_REASONS)[number]
export type ConverterVerdict = (typeof CONVERTER_VERDICTS)[number]
export type AirlineClass = (typeof AIRLINE_CLASSES)[number]
export type Severity = (typeof SEVERITIES)[number]

// ---------- Result ----------
// Results are produced by the engine; the schema documents them and lets tests and the client
// check a response. Plain z.number() refuses NaN and Infinity, which the engine never returns.

const finite = z.number()

export const warningSchema = z.object({
  code: z.string(),
  message: z.string(),
  severity: z.enum(SEVERITIES),
  /** The minute of the run the message names, when it names one (a plan shows it on its clock). */
  atMinute: finite.optional(),
})

export const timelinePointSchema = z.object({
  minute: finite,
  socPct: finite,
  /** Pack terminal voltage under the load at that moment. */
  voltageV: finite,
  /** Power out of the pack terminals; while charging, minus the power stored in the pack. */
  drawW: finite,
  /** Clip power over the programme's peak power (of the segment, or the request's programme). */
  headroomDb: finite,
  pack: z.number().int(),
  clipPowerW: finite,
  state: z.enum(SEGMENT_STATES),
})

export const converterResultSchema = z.object({
  label: z.string(),
  verdict: z.enum(CONVERTER_VERDICTS),
  feed: z.enum(ACCESSORY_FEEDS),
  /** Whether the chosen feed suits the pack's window and the accessory's input range. */
  fits: z.boolean(),
  /** What to fit, in plain words. */
  advice: z.string(),
  windowMinV: finite,
  windowMaxV: finite,
  /** Voltage the accessory receives (outputV for converters, the pack window's top for direct). */
  suppliedV: finite,
  packDrawW: finite,
  lossW: finite,
  /** Heat in a linear regulator at full charge (the worst case); 0 for other feeds. */
  linearHeatW: finite,
})

export const packRunSchema = z.object({
  pack: z.number().int(),
  startMinute: finite,
  endMinute: finite,
  /** Why this pack left the rig: a stop reason, or 'swapped' at a planned break. */
  endReason: z.union([z.enum(STOP_REASONS), z.literal('swapped')]),
  musicMinutes: finite,
  lowestSocPct: finite,
})

/** One segment of the day as planned, with its draw and how loud it is at the listener. */
export const segmentResultSchema = z.object({
  label: z.string(),
  state: z.enum(SEGMENT_STATES),
  /** Planned start and length: swaps take no time, so the plan's clock is the run's. */
  startMinute: finite,
  minutes: finite,
  /** Average power out of the pack over the segment; negative while charging (power into it). */
  drawW: finite,
  /** Equivalent level at the listener over the segment, pauses included (exposure). */
  splDb: finite.optional(),
  /** Level while the music plays: what a sound level meter reads then (A-weighted, free field). */
  playingSplDb: finite.optional(),
  /** NIOSH permitted time at the segment's equivalent level. */
  permittedMinutes: finite.optional(),
})

export const assumedValueSchema = z.object({
  field: z.string(),
  value: z.union([finite, z.string(), z.boolean()]),
  source: z.string(),
})

export const estimateResultSchema = z.object({
  engineVersion: z.string(),
  runtimeHours: finite,
  stopReason: z.enum(STOP_REASONS),
  /** Hours with the rig in an 'on' segment until it stopped. */
  musicHours: finite,
  averageDrawW: finite,
  loadOhm: finite,
  leadResistanceOhm: finite,
  energyWh: z.object({ nominal: finite, delivered: finite, drawn: finite }),
  airlineClass: z.enum(AIRLINE_CLASSES),
  breakdownWh: z.object({
    amplifierOutput: finite,
    amplifierLoss: finite,
    accessories: finite,
    converterLoss: finite,
    leadLoss: finite,
    packLoss: finite,
  }),
  clipPowerW: z.object({ full: finite, cutoff: finite }),
  /** Largest instantaneous supply current on a sustained bass note over the whole run. */
  peakCurrentA: finite,
  /** Lowest voltage at the pack's own terminals on those peaks. */
  minPeakTerminalV: finite,
  /** Extension: lowest voltage at the amplifier's terminals (after the lead) on those peaks. */
  minPeakSupplyV: finite,
  dropoutRisk: z.boolean(),
  /**
   * Extension: the part that mutes first on bass peaks, the charge below which it does, the first
   * minute of it, and the fixes in numbers that clear it.
   */
  dropout: z
    .object({
      belowSocPct: finite,
      fromMinute: finite.nullable(),
      /** 'amplifier', or the label of an accessory fed directly from the lead. */
      part: z.string(),
      /** The amplifier's lock-out or the accessory's minimum input. */
      floorV: finite,
      fix: z.object({
        lead: z.object({ awg: z.number().int(), areaMm2: finite, lengthM: finite }).nullable(),
        quieterDb: finite.nullable(),
        parallelCells: z.number().int().nullable(),
      }),
    })
    .nullable(),
  splDb: z.object({ average: finite, peak: finite }).optional(),
  exposure: z
    .object({
      permittedMinutes: finite,
      levelDb: finite,
      dosePct: finite.optional(),
      overWhoVenueLimit: z.boolean(),
    })
    .optional(),
  converters: z.array(converterResultSchema),
  warnings: z.array(warningSchema),
  timeline: z.array(timelinePointSchema).max(500),
  schedule: z
    .object({
      lasts: z.boolean(),
      packsUsed: z.number().int(),
      swaps: z.array(z.object({ atMinute: finite, pack: z.number().int() })),
      totalMinutes: finite,
      stoppedAtMinute: finite.nullable(),
      segments: z.array(segmentResultSchema),
      /** Charge left in the pack in the rig when the run ends. */
      endSocPct: finite,
      /** Packs on hand never put in the rig. */
      sparePacks: z.number().int(),
    })
    .optional(),
  /** Speaker leads (per channel, round trip) and the share of the amplifier's output they heat. */
  speakerLeads: z.object({ resistanceOhm: finite, lossPct: finite }),
  pack: z.object({
    label: z.string().optional(),
    nominalV: finite,
    fullV: finite,
    /** Extension: straight off the charger, what the maximum-voltage checks use. */
    chargedV: finite,
    cutoffV: finite,
    ratedCapacityAh: finite,
    capacityAh: finite,
    resistanceOhm: finite,
    nominalWh: finite,
    count: z.number().int(),
    massKg: finite.optional(),
    whPerKg: finite.optional(),
  }),
  amplifier: z.object({
    outputResistanceOhm: finite,
    lockoutV: finite.nullable(),
    supplyMaxV: finite.nullable(),
    /** Average output over the 'on' time, all channels. */
    averageOutputW: finite,
  }),
  speakers: z.object({
    loadOhm: finite,
    driversPerChannel: z.number().int(),
    powerPerDriverW: z.object({ average: finite, peak: finite }),
  }),
  leads: z.object({
    resistanceOhm: finite,
    dropPct: z.object({ average: finite, peak: finite }),
    averageLossW: finite,
  }),
  headroom: z.object({ minimumDb: finite, clipsFromMinute: finite.nullable() }),
  averageCurrentA: finite,
  lowestSocPct: finite,
  packRuns: z.array(packRunSchema),
  assumed: z.array(assumedValueSchema),
})

export type EstimateResult = z.infer<typeof estimateResultSchema>
export type EstimateWarning = z.infer<typeof warningSchema>
export type TimelinePoint = z.infer<typeof timelinePointSchema>
export type ConverterResult = z.infer<typeof converterResultSchema>
export type PackRun = z.infer<typeof packRunSchema>
export type SegmentResult = z.infer<typeof segmentResultSchema>
export type AssumedValue = z.infer<typeof assumedValueSchema>
