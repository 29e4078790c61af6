// The runtime card's content: what the printed card, the shared page and the e-mail all show.
// Built once by build.ts from a plan (or a rig alone) and the engine result; every text is final
// wording, so the three renderings only lay it out and cannot drift apart.
import type { Severity } from '../schemas/estimate'

export interface CardSwap {
  /** Minutes from the start of the day (or of the run, for a rig alone). */
  atMinute: number
  /** "11:30" on the event clock for a plan, "after 3 h 30 min" for a rig alone. */
  atLabel: string
  /** The pack that goes in (1 is the first). */
  packIn: number
  /** "Swap in charged pack 2 of 3". */
  instruction: string
}

export interface CardSegment {
  /** Event clock for a plan ("08:00"), elapsed time for a rig ("0 h 30 min"). */
  startLabel: string
  endLabel: string
  label: string
  /** What the rig does: "Sound 90 % of the time; peaks 2 dB below clipping". */
  activity: string
  /** What a sound level meter should read while the music plays; null for a silent segment. */
  meter: string | null
}

export interface CardWarning {
  code: string
  severity: Exclude<Severity, 'info'>
  message: string
}

export type CautionTopic = 'hearing' | 'battery' | 'wiring'

export interface CardCaution {
  topic: CautionTopic
  title: string
  text: string
}

export interface RuntimeCard {
  kind: 'plan' | 'rig'
  /** The plan's name, or the rig's for a rig alone. */
  title: string
  rigName: string
  /** "Saturday 13 June 2026"; null for a rig alone. */
  dateLabel: string | null
  /** "08:00 to 14:00"; null for a rig alone. */
  timeLabel: string | null
  /** The rig in one line: pack, amplifier, speakers, accessories. */
  rigLine: string
  /** Temperature, listener distance, children: what the estimate assumed of the place. */
  conditions: string
  runtime: {
    /** Whether the packs on hand last the schedule; null without a schedule. */
    lasts: boolean | null
    headline: string
    runtimeMinutes: number
    musicMinutes: number
    /** When the rig stops early, on the card's clock; null when it lasts (or has no schedule). */
    stopsAtLabel: string | null
  }
  packs: {
    /** Charged packs to bring (more than on hand when those do not last). */
    bringCharged: number
    onHand: number
    /** What one pack is: "Crew tool pack: 36 V Li-ion, 10S2P, 5 Ah, 180 Wh". */
    packLabel: string
    headline: string
  }
  swaps: CardSwap[]
  /** Said instead of the swap list when there is none. */
  noSwapNote: string
  segments: CardSegment[]
  /** How to set the levels by meter, and that the readings are estimates; null without music. */
  meterNote: string | null
  /** The estimated level at the listener and the exposure it allows; null without sensitivity. */
  sound: string | null
  /**
   * Danger first, then caution; notes ("info") stay on the bench, and the hearing warnings are
   * said by the hearing caution with their figures.
   */
  warnings: CardWarning[]
  cautions: CardCaution[]
  notes: string
  /** The line that defers to measurement, local codes and licensed practice. */
  disclaimer: string
  engineVersion: string
}

/** Section headings, the same on the printed card, the shared page and the e-mail. */
export const CARD_HEADINGS = {
  runtime: 'Expected runtime',
  swaps: 'Swap times',
  packs: 'Packs to bring charged',
  day: 'The day',
  warnings: 'Key warnings',
  cautions: 'Cautions',
  notes: 'Notes',
} as const

export const SEVERITY_WORDS: Record<CardWarning['severity'], string> = {
  danger: 'Danger',
  caution: 'Caution',
}
