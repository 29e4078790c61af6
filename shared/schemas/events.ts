// Body and answer of an event: one day of several saved plans sharing a pool of packs and the
// venue's chargers. The answer is computed by shared/events/run-event.ts, on the server for the
// stored item and in the same way for a preview while the crew edits.
import { z } from 'zod'
import { SEVERITIES, text } from './estimate'
import { numberField } from './number-field'
import { planDateSchema } from './plans'
import {
  resourceNameSchema,
  resourceNotesSchema,
  versionFieldSchema,
  type SavedItemMeta,
} from './resources'

export const EVENT_PLANS_MAX = 12
export const EVENT_CHARGERS_MAX = 20
export const EVENT_POOL_KINDS_MAX = 20

const planIdMessage = 'Each plan must be the id of one of the team’s saved plans'
const kindMessage = 'Pack kind must be text of 1 to 80 characters (a kind the event’s plans use)'
const packKindSchema = z
  .string({ error: kindMessage })
  .trim()
  .min(1, { error: kindMessage })
  .max(80, { error: kindMessage })

export const eventPoolEntrySchema = z.object(
  {
    kind: packKindSchema,
    count: numberField('pool.count'),
  },
  { error: 'Each pool entry needs a pack kind and how many are on hand' },
)

export const eventChargerSchema = z.object(
  {
    label: text('Charger name', 80),
    powerW: numberField('charger.powerW'),
    slots: numberField('charger.slots'),
    packKinds: z
      .array(packKindSchema, { error: 'Pack kinds this charger fits must be a list' })
      .min(1, { error: 'Name at least one pack kind this charger fits' })
      .max(EVENT_POOL_KINDS_MAX, { error: `At most ${EVENT_POOL_KINDS_MAX} pack kinds` }),
  },
  { error: 'Each charger needs a name, its power, its slots and the pack kinds it fits' },
)

export const eventBodySchema = z.object(
  {
    name: resourceNameSchema,
    notes: resourceNotesSchema.optional(),
    date: planDateSchema,
    planIds: z
      .array(
        z
          .number({ error: planIdMessage })
          .int({ error: planIdMessage })
          .positive({ error: planIdMessage }),
        {
          error: 'Plans must be a list of plan ids',
        },
      )
      .min(1, { error: 'An event needs at least one plan' })
      .max(EVENT_PLANS_MAX, { error: `An event may have at most ${EVENT_PLANS_MAX} plans` })
      .refine((ids) => new Set(ids).size === ids.length, {
        error: 'Each plan may appear only once in an event',
      }),
    pool: z
      .array(eventPoolEntrySchema, { error: 'Pool must be a list of pack kinds and counts' })
      .max(EVENT_POOL_KINDS_MAX, { error: `At most ${EVENT_POOL_KINDS_MAX} pack kinds` })
      .refine((entries) => new Set(entries.map((entry) => entry.kind)).size === entries.length, {
        error: 'Each pack kind may appear only once in the pool',
      }),
    chargers: z
      .array(eventChargerSchema, { error: 'Chargers must be a list' })
      .max(EVENT_CHARGERS_MAX, { error: `At most ${EVENT_CHARGERS_MAX} chargers` }),
  },
  { error: 'An event must be a JSON object' },
)
/** What the answer depends on: a preview while the crew edits needs no name or date. */
export const eventPreviewSchema = eventBodySchema.pick({
  planIds: true,
  pool: true,
  chargers: true,
})

export const eventUpdateSchema = z.intersection(eventBodySchema, versionFieldSchema)

export type EventBody = z.infer<typeof eventBodySchema>
export type EventPreviewBody = z.infer<typeof eventPreviewSchema>
export type EventCharger = z.infer<typeof eventChargerSchema>
export type EventPoolEntry = z.infer<typeof eventPoolEntrySchema>

/** One pack's turn in a rig, on the event clock (minutes after the event day's midnight). */
export interface EventPackTurn {
  /** "Tool pack 18 V #2": the kind's label and the pack's number in the pool. */
  packName: string
  packNumber: number
  startMinute: number
  endMinute: number
  /** State of charge when it left the rig. */
  endSocPct: number
}

export interface EventRigAnswer {
  planId: number
  planName: string
  rigName: string
  kindKey: string
  startMinute: number
  /** Where the plan's schedule ends. */
  endMinute: number
  /** With every pack it wants charged, the engine says the plan's day lasts. */
  lastsOnItsOwn: boolean
  /** And with the event's pool and chargers. */
  lasts: boolean
  /** The minute the rig stops: it ran out of charged packs, or the engine stopped it. */
  stopsAtMinute: number | null
  /** Why it stops, in plain words, with what to change; null when it lasts. */
  stopReason: string | null
  worstSeverity: (typeof SEVERITIES)[number] | null
  /** The engine's danger warnings for this plan: the rig must not run as planned. */
  dangers: string[]
  turns: EventPackTurn[]
  /** Each swap: the minute a charged pack goes in. */
  swapMinutes: number[]
}

export interface EventKindAnswer {
  key: string
  label: string
  onHand: number
  /** Fewest packs of this kind, brought charged, with which every rig lasts. */
  toBring: number
  /** Packs of this kind every rig's day uses in all (swaps included). */
  turns: number
  nominalWh: number
  isLithium: boolean
}

export interface EventChargeSession {
  chargerIndex: number
  chargerLabel: string
  slot: number
  packName: string
  kindKey: string
  /** When the pack left its rig and joined the queue. */
  queuedMinute: number
  onMinute: number
  /** When it is full; null when the day ends first. */
  offMinute: number | null
  fromSocPct: number
}

export interface EventPoolPoint {
  minute: number
  /** Charge in every pack of the pool (in rigs, in the box, on chargers) over their full charge. */
  socPct: number
  /** Charged packs waiting in the box, all kinds. */
  chargedInBox: number
}

export interface EventCaution {
  code: string
  severity: (typeof SEVERITIES)[number]
  message: string
}

export interface EventAnswer {
  engineVersion: string
  /** Every rig lasts with the pool and chargers, and none has a danger. */
  lasts: boolean
  startMinute: number
  endMinute: number
  rigs: EventRigAnswer[]
  kinds: EventKindAnswer[]
  sessions: EventChargeSession[]
  /** Every pack a rig came for was charged in time (no rig waited on a charger). */
  chargersKeepUp: boolean
  /** Longest time a pack waited for a free charger slot. */
  longestQueueMinutes: number
  /** Packs left uncharged when the day ends (still charging or waiting). */
  unchargedAtEnd: number
  pool: EventPoolPoint[]
  cautions: EventCaution[]
  /** The lowest temperature among the plans: the venue's air, where the chargers stand too. */
  coldestC: number
}

/** What a list row shows. */
export interface EventSummary {
  engineVersion: string
  lasts: boolean
  rigCount: number
  packsToBring: { kind: string; label: string; count: number; onHand: number }[]
  worstSeverity: (typeof SEVERITIES)[number] | null
}

/** A row of the events list: the summary stored at the last save, and no answer. */
export interface EventListItem extends SavedItemMeta {
  date: string
  planIds: number[]
  pool: EventPoolEntry[]
  chargers: EventCharger[]
  /** Null only for an event saved before summaries were stored, until the server's next start. */
  summary: EventSummary | null
}

/** One event as read on its own: its answer worked out from the plans as saved now. */
export interface EventItem extends EventListItem {
  summary: EventSummary
  answer: EventAnswer
}

/** A plan of an event as the event page offers it. */
export interface EventPlanChoice {
  id: number
  name: string
  rigName: string
  startTime: string
  kindKey: string
  kindLabel: string
}

/** An event's card: what the crew lead prints, and what a share link shows (no ids). */
export interface EventCard {
  title: string
  notes: string
  date: string
  answer: Omit<EventAnswer, 'rigs'> & { rigs: Omit<EventRigAnswer, 'planId'>[] }
}

export interface SharedEventCardResponse {
  card: EventCard
  expiresAt: string | null
}

export function eventCardOf(event: {
  name: string
  notes: string
  date: string
  answer: EventAnswer
}): EventCard {
  return {
    title: event.name,
    notes: event.notes,
    date: event.date,
    answer: {
      ...event.answer,
      rigs: event.answer.rigs.map(({ planId: _planId, ...rig }) => rig),
    },
  }
}
